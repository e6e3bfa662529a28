// What the browser benchmarks need, started the way `npm test` starts it (scripts/lib): a
// throwaway MariaDB and fakes on free ports, migrated and seeded with the demo shop, the app
// built for this source version and served on a free port. stop() removes all of it.
import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { chromium, type Browser, type Page } from "playwright-core";

type Lib = {
  startServices(o: Record<string, unknown>): Promise<{ env: Record<string, string>; stop(): Promise<void> }>;
  ensureBuild(o: { perVersion: boolean }): string;
  freePort(): Promise<number>;
};

// Plain-JS helpers shared with scripts/test.mjs; imported by computed path (they carry no types).
const lib = (name: string) => `../lib/${name}.mjs`;

export const CHROMIUM_ARGS = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function waitForHttp(url: string, ms = 90_000) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    try {
      if ((await fetch(url)).status < 500) return;
    } catch {
      /* not up yet */
    }
    await sleep(250);
  }
  throw new Error(`The app did not answer at ${url}`);
}

export async function startApp(): Promise<{ baseUrl: string; stop: () => Promise<void> }> {
  const { startServices } = (await import(lib("services"))) as Lib;
  const { ensureBuild } = (await import(lib("build"))) as Lib;
  const { freePort } = (await import(lib("ports"))) as Lib;
  const dataRoot = mkdtempSync(join(tmpdir(), "tenthwise-bench-"));
  const secrets = {
    SESSION_SECRET: randomBytes(32).toString("hex"),
    LINK_SECRET: randomBytes(32).toString("hex"),
    DB_APP_PASSWORD: randomBytes(12).toString("hex"),
  };
  const [dbPort, smtpPort, s3Port, appPort] = [await freePort(), await freePort(), await freePort(), await freePort()];
  const services = await startServices({ mode: "test", dataRoot, dbPort, smtpPort, s3Port, secrets });
  const baseUrl = `http://127.0.0.1:${appPort}`;
  let server: ChildProcess | undefined;
  const stop = async () => {
    if (server && server.exitCode === null) {
      server.kill("SIGTERM");
      await new Promise((r) => {
        server!.once("exit", r);
        setTimeout(r, 5000);
      });
    }
    await services.stop();
    rmSync(dataRoot, { recursive: true, force: true });
  };
  try {
    const env = {
      ...process.env,
      ...services.env,
      NEXT_TELEMETRY_DISABLED: "1",
      SESSION_SECRET: secrets.SESSION_SECRET,
      LINK_SECRET: secrets.LINK_SECRET,
      APP_URL: baseUrl,
      NOTIFY_INTERVAL_SECONDS: "0",
    };
    execFileSync(
      "node",
      ["node_modules/tsx/dist/cli.mjs", "--conditions=react-server", "scripts/db-setup.ts", "--seed"],
      { stdio: "inherit", env },
    );
    // TW_BENCH_DIST_DIR: serve a build made by hand (e.g. with TW_SOURCE_MAPS=1 for profiling).
    const distDir = process.env.TW_BENCH_DIST_DIR || ensureBuild({ perVersion: true });
    server = spawn("node", ["node_modules/next/dist/bin/next", "start", "-p", String(appPort), "-H", "127.0.0.1"], {
      stdio: ["ignore", "ignore", "inherit"],
      env: { ...env, NODE_ENV: "production", TW_DIST_DIR: distDir },
    });
    await waitForHttp(`${baseUrl}/sign-in`);
    return { baseUrl, stop };
  } catch (err) {
    await stop();
    throw err;
  }
}

export function launch(): Promise<Browser> {
  return chromium.launch({ executablePath: "/usr/bin/chromium", args: CHROMIUM_ARGS, headless: true });
}

export async function signIn(page: Page, baseUrl: string, email: string, password: string) {
  await page.goto(`${baseUrl}/sign-in`, { waitUntil: "networkidle" });
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
}

/** Nearest-rank percentile (p in 0..100) of a sample. */
export function percentile(values: number[], p: number): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))];
}
