// `npm test`: every test, browser tests included, against a throwaway MariaDB and throwaway fakes
// on free loopback ports. Nothing of the demo datadir is touched; everything is removed at the end.
import { spawn, spawnSync, execFileSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { randomBytes } from "node:crypto";
import { ensureNodeModules } from "./lib/deps.mjs";
import { withoutOwnerAccount } from "./lib/db-accounts.mjs";
import { ensureSystemPackages } from "./lib/system.mjs";
import { freePort } from "./lib/ports.mjs";

const STATIC_CHECKS = [
  ["type-checking (tsc --noEmit)", ["node_modules/typescript/bin/tsc", "--noEmit", "-p", "."]],
  ["linting (eslint)", ["node_modules/eslint/bin/eslint.js", "--max-warnings", "0", "."]],
  [
    "checking the format (prettier --check)",
    ["node_modules/prettier/bin/prettier.cjs", "--check", "--log-level", "warn", "."],
  ],
];

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

async function waitForHttp(url, timeoutMs = 60_000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      const r = await fetch(url);
      if (r.status < 500) return;
    } catch {
      /* not up yet */
    }
    await sleep(250);
  }
  throw new Error(`The app did not answer at ${url}`);
}

async function main() {
  ensureNodeModules();
  ensureSystemPackages(["mariadbd", "chromium"]);
  const { startServices } = await import("./lib/services.mjs");
  const { ensureBuild } = await import("./lib/build.mjs");
  const dataRoot = mkdtempSync(join(tmpdir(), "tenthwise-test-"));
  const secrets = {
    SESSION_SECRET: randomBytes(32).toString("hex"),
    LINK_SECRET: randomBytes(32).toString("hex"),
    DB_APP_PASSWORD: randomBytes(12).toString("hex"),
    DB_OWNER_PASSWORD: randomBytes(12).toString("hex"),
  };
  const [dbPort, smtpPort, s3Port, appPort] = [await freePort(), await freePort(), await freePort(), await freePort()];
  const services = await startServices({ mode: "test", dataRoot, dbPort, smtpPort, s3Port, secrets });
  let server;
  let vitest;
  let cleaning = null;
  const cleanup = () =>
    (cleaning ??= (async () => {
      if (vitest && vitest.exitCode === null) vitest.kill("SIGTERM");
      if (server && server.exitCode === null) {
        server.kill("SIGTERM");
        await new Promise((r) => {
          server.once("exit", r);
          setTimeout(r, 5000);
        });
      }
      await services.stop();
      rmSync(dataRoot, { recursive: true, force: true });
    })());
  const onSignal = async () => {
    await cleanup();
    process.exit(130);
  };
  process.on("SIGINT", onSignal);
  process.on("SIGTERM", onSignal);

  let code = 1;
  try {
    const baseUrl = `http://127.0.0.1:${appPort}`;
    const env = {
      ...process.env,
      ...services.env,
      NEXT_TELEMETRY_DISABLED: "1",
      SESSION_SECRET: secrets.SESSION_SECRET,
      LINK_SECRET: secrets.LINK_SECRET,
      APP_URL: baseUrl,
      TW_BASE_URL: baseUrl,
      TW_TEST_DATA_ROOT: dataRoot,
      TW_DB_PORT: String(dbPort),
    };
    execFileSync(
      "node",
      ["node_modules/tsx/dist/cli.mjs", "--conditions=react-server", "scripts/db-setup.ts", "--seed"],
      { stdio: "inherit", env },
    );
    // Only browser tests need the built app; a run of named unit/integration files skips it.
    const args = process.argv.slice(2);
    const needsApp = args.length === 0 || args.some((a) => a.includes("browser"));
    if (needsApp) {
      const distDir = ensureBuild({ perVersion: true });
      // The app runs with its own database account only; tests that tamper use the owner's.
      const serverEnv = withoutOwnerAccount(env);
      server = spawn("node", ["node_modules/next/dist/bin/next", "start", "-p", String(appPort), "-H", "127.0.0.1"], {
        stdio: ["ignore", "ignore", "inherit"],
        env: { ...serverEnv, NODE_ENV: "production", TW_DIST_DIR: distDir },
      });
      await waitForHttp(`${baseUrl}/sign-in`);
    }
    vitest = spawn("node", ["node_modules/vitest/vitest.mjs", "run", ...process.argv.slice(2)], {
      stdio: "inherit",
      env: { ...env, NODE_ENV: "test" },
    });
    code = await new Promise((r) => vitest.on("exit", (c) => r(c ?? 1)));
    if (process.argv.length <= 2) {
      // A full run also checks what the build skips (see next.config.mjs): types, lint with the
      // layout's import boundaries (eslint.config.mjs), and formatting.
      for (const [what, args] of STATIC_CHECKS) {
        console.log(`[tenthwise] ${what} …`);
        if (spawnSync("node", args, { stdio: "inherit" }).status !== 0) code = code || 1;
      }
    }
  } catch (err) {
    console.error(`[tenthwise] ${err.message}`);
  } finally {
    await cleanup();
  }
  process.exit(code);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
