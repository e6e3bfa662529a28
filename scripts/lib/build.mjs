// Builds the app (next build, then the service worker) when the sources changed since the last build.
import { execSync } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { join } from "node:path";

const SOURCES = ["app", "components", "hooks", "lib", "models", "migrations", "public"];
const FILES = [
  "package-lock.json",
  "next.config.mjs",
  "tailwind.config.ts",
  "postcss.config.mjs",
  "tsconfig.json",
  "serwist.config.js",
];
const SKIP = /(^|\/)(sw\.js|sw\.js\.map|swe-worker-.*\.js)$/;

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

const LOCK = ".next-build.lock";

function alive(pid) {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

// Two runs on one checkout (npm start and npm test, say) must not build at the same time:
// the second waits for the first and then finds the build already current.
function withBuildLock(fn) {
  for (;;) {
    try {
      mkdirSync(LOCK);
      writeFileSync(`${LOCK}/pid`, String(process.pid));
      break;
    } catch {
      const pid = Number(existsSync(`${LOCK}/pid`) ? readFileSync(`${LOCK}/pid`, "utf8") : 0);
      if (pid && !alive(pid)) rmSync(LOCK, { recursive: true, force: true });
      else execSync("sleep 1");
    }
  }
  try {
    return fn();
  } finally {
    rmSync(LOCK, { recursive: true, force: true });
  }
}

const stampOf = (distDir) => `${distDir}/.tenthwise-source-hash`;
const current = (distDir, hash) =>
  existsSync(stampOf(distDir)) && readFileSync(stampOf(distDir), "utf8") === hash && existsSync(`${distDir}/BUILD_ID`);

/**
 * Builds when the sources changed and returns the folder the server must use (as TW_DIST_DIR).
 * `perVersion` (tests) builds each source version into its own folder under .next-test/.
 */
export function ensureBuild({ force = false, perVersion = false } = {}) {
  const hash = sourceHash();
  const distDir = perVersion ? `.next-test/${hash.slice(0, 12)}` : ".next";
  if (!force && current(distDir, hash)) return distDir;
  withBuildLock(() => {
    build(distDir, force);
    if (perVersion) pruneOldVersions(distDir);
  });
  return distDir;
}

// Keeps the newest few test builds; older ones are no longer served by any recent run.
function pruneOldVersions(keep) {
  const dirs = readdirSync(".next-test")
    .map((d) => `.next-test/${d}`)
    .filter((d) => d !== keep)
    .map((d) => ({ d, t: statSync(d).mtimeMs }))
    .sort((a, b) => b.t - a.t);
  for (const { d } of dirs.slice(3)) rmSync(d, { recursive: true, force: true });
}

function build(distDir, force) {
  const hash = sourceHash();
  if (!force && current(distDir, hash)) return;
  console.log(`[tenthwise] building the app (next build → ${distDir}) …`);
  const env = { ...process.env, NEXT_TELEMETRY_DISABLED: "1", NODE_ENV: "production", TW_DIST_DIR: distDir };
  // Next edits the tsconfig it builds with (adding its distDir's types), so it gets a generated,
  // git-ignored one and the committed tsconfig.json stays as written.
  writeFileSync("tsconfig.next.json", JSON.stringify({ extends: "./tsconfig.json" }, null, 2));
  execSync("node node_modules/next/dist/bin/next build", { stdio: "inherit", env });
  if (existsSync("serwist.config.js"))
    execSync("node node_modules/@serwist/cli/cli.js build", { stdio: "inherit", env });
  writeFileSync(stampOf(distDir), hash);
}
