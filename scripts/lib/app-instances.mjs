// N production app servers (`next start` on the existing build) on free loopback ports, each with
// the given environment plus its own part (dbFor(i): which database node it uses). The pid kept is
// the server's own (node running Next directly, not behind npx), so a kill leaves nothing behind.
import { spawn } from "node:child_process";
import { freePort } from "./ports.mjs";

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/** Waits until the server answers HTTP at all (any status: a 503 from /api/health is an answer). */
export async function waitForHttp(url, timeoutMs = 60_000, isUp = () => true) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      const r = await fetch(url, { signal: AbortSignal.timeout(5000) });
      if (isUp(r)) return;
    } catch {
      /* not up yet */
    }
    await sleep(250);
  }
  throw new Error(`Nothing answered at ${url} in ${timeoutMs / 1000} s`);
}

export async function startApps({ count, env, dbFor = () => ({}), host = "127.0.0.1", output = "ignore" }) {
  const apps = [];
  const children = [];
  for (let i = 0; i < count; i++) {
    const port = await freePort();
    apps.push({ name: `app${i + 1}`, url: `http://${host}:${port}`, port, pid: null });
  }

  async function launch(i) {
    const app = apps[i];
    const child = spawn("node", ["node_modules/next/dist/bin/next", "start", "-p", String(app.port), "-H", host], {
      stdio: ["ignore", output, "inherit"],
      env: { ...env, NODE_ENV: "production", NEXT_TELEMETRY_DISABLED: "1", ...dbFor(i) },
    });
    children[i] = child;
    app.pid = child.pid;
    let exited = false;
    child.on("exit", () => {
      exited = true;
      if (children[i] === child) children[i] = null;
    });
    await waitForHttp(`${app.url}/api/health`, 90_000, () => {
      if (exited) throw new Error(`${app.name} exited while starting`);
      return true;
    });
  }

  async function waitExit(child, ms) {
    if (!child || child.exitCode !== null || child.signalCode !== null) return;
    await new Promise((r) => {
      const t = setTimeout(r, ms);
      child.once("exit", () => {
        clearTimeout(t);
        r();
      });
    });
  }

  /** SIGKILL one instance (as a crash would: requests in flight are cut). */
  async function kill(i) {
    const child = children[i];
    if (!child) return;
    child.kill("SIGKILL");
    await waitExit(child, 5000);
  }

  /** Starts a killed or stopped instance again on the same port. */
  async function restart(i) {
    await kill(i);
    await launch(i);
  }

  let stopping = null;
  function stop() {
    stopping ??= Promise.all(
      children.map(async (child) => {
        if (!child) return;
        child.kill("SIGTERM");
        await waitExit(child, 8000);
        if (child.exitCode === null && child.signalCode === null) child.kill("SIGKILL");
        await waitExit(child, 2000);
      }),
    );
    return stopping;
  }

  try {
    await Promise.all(apps.map((_, i) => launch(i)));
  } catch (err) {
    await stop();
    throw err;
  }
  return { apps, kill, restart, stop };
}
