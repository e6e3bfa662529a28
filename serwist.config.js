// @ts-check
// Configurator mode (STACK.md): `next build && serwist build`. Every page renders per request (its
// scripts carry that request's nonce, proxy.ts), so nothing is prerendered: the bench shells are
// listed by hand, revised with each build. The worker keeps the copy it fetched, nonce and policy
// header together, so offline the shell runs under the very policy it was served with.
// The worker is written into the build folder itself and served by app/sw.js/route.ts, so each
// build (npm test makes one per source version) serves the worker that matches its own chunks.
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import { generateGlobPatterns, serwist } from "@serwist/next/config";

const distDir = process.env.TW_DIST_DIR || ".next";

// The manifest is a route (app/manifest.ts), not a file, so it is listed by hand; its revision
// follows its source so a changed manifest is fetched again.
const manifestRevision = createHash("sha256").update(readFileSync("app/manifest.ts")).digest("hex").slice(0, 16);
const buildId = readFileSync(`${distDir}/BUILD_ID`, "utf8").trim();
const BENCH_SHELLS = ["/bench", "/bench/job", "/bench/studies"];

export default serwist({
  swSrc: "app/sw.ts",
  swDest: `${distDir}/tw-sw/sw.js`,
  precachePrerendered: false,
  // Next's defaults plus the fonts (next/font puts them under static/media), so the bench keeps
  // its own look offline even when the first visit loaded them before the worker was in control.
  globPatterns: [...generateGlobPatterns(`${distDir}/`), `${distDir}/static/media/*.woff2`],
  additionalPrecacheEntries: [
    { url: "/manifest.webmanifest", revision: manifestRevision },
    ...BENCH_SHELLS.map((url) => ({ url, revision: buildId })),
  ],
  maximumFileSizeToCacheInBytes: 4 * 1024 * 1024,
});
