// @ts-check
// Configurator mode (STACK.md): `next build && serwist build`. Runs after Next has prerendered,
// so the bench shells (/bench, /bench/job) are in the precache with their content hashes.
// The worker is written into the build folder itself and served by app/sw.js/route.ts, so each
// build (npm test makes one per source version) serves the worker that matches its own chunks.
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import { generateGlobPatterns, serwist } from "@serwist/next/config";

const distDir = process.env.TW_DIST_DIR || ".next";

// The manifest is a route (app/manifest.ts), not a file, so it is listed by hand; its revision
// follows its source so a changed manifest is fetched again.
const manifestRevision = createHash("sha256").update(readFileSync("app/manifest.ts")).digest("hex").slice(0, 16);

export default serwist({
  swSrc: "app/sw.ts",
  swDest: `${distDir}/tw-sw/sw.js`,
  precachePrerendered: true,
  // Next's defaults plus the fonts (next/font puts them under static/media), so the bench keeps
  // its own look offline even when the first visit loaded them before the worker was in control.
  globPatterns: [...generateGlobPatterns(`${distDir}/`), `${distDir}/static/media/*.woff2`],
  additionalPrecacheEntries: [{ url: "/manifest.webmanifest", revision: manifestRevision }],
  maximumFileSizeToCacheInBytes: 4 * 1024 * 1024,
});
