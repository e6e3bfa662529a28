// Runs `npm ci` when node_modules is missing or older than package-lock.json.
import { execSync } from "node:child_process";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { createHash } from "node:crypto";

const STAMP = "node_modules/.tenthwise-lock-hash";

export function ensureNodeModules() {
  const lock = readFileSync("package-lock.json");
  const hash = createHash("sha256").update(lock).digest("hex");
  if (existsSync(STAMP) && readFileSync(STAMP, "utf8") === hash) return;
  if (!existsSync("node_modules") || !existsSync(STAMP) || readFileSync(STAMP, "utf8") !== hash) {
    console.log("[tenthwise] installing npm packages (npm ci) …");
    execSync("npm ci --no-audit --no-fund --loglevel=error", { stdio: "inherit" });
    writeFileSync(STAMP, hash);
  }
}
