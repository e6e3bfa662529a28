// Builds the app (next build, then the service worker) when the sources changed since the last build.
import { execSync } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";

const SOURCES = ["app", "components", "hooks", "lib", "models", "migrations", "public"];
const FILES = ["package-lock.json", "next.config.mjs", "tailwind.config.ts", "postcss.config.mjs", "tsconfig.json", "serwist.config.js"];
const SKIP = /(^|\/)(sw\.js|sw\.js\.map|swe-worker-.*\.js)$/;
const STAMP = ".next/.tenthwise-source-hash";

function walk(dir, out) {
  if (!existsSync(dir)) return;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, entry.name);
    if (entry.isDirectory()) walk(p, out);
    else if (!SKIP.test(p)) out.push(p);
  }
}

function sourceHash() {
  const files = [];
  for (const d of SOURCES) walk(d, files);
  for (const f of FILES) if (existsSync(f)) files.push(f);
  const h = createHash("sha256");
  for (const f of files.sort()) h.update(f).update(readFileSync(f));
  return h.digest("hex");
}

export function ensureBuild({ force = false } = {}) {
  const hash = sourceHash();
  if (!force && existsSync(STAMP) && readFileSync(STAMP, "utf8") === hash && existsSync(".next/BUILD_ID")) return false;
  console.log("[tenthwise] building the app (next build) …");
  const env = { ...process.env, NEXT_TELEMETRY_DISABLED: "1", NODE_ENV: "production" };
  execSync("node node_modules/next/dist/bin/next build", { stdio: "inherit", env });
  if (existsSync("serwist.config.js")) execSync("node node_modules/@serwist/cli/cli.js build", { stdio: "inherit", env });
  writeFileSync(STAMP, hash);
  return true;
}
