// HAProxy (Debian's haproxy) in front of the app instances: HTTP, round robin, each instance checked
// with GET /api/health (a 503 there, e.g. its database node is not synced, takes it out of the
// rotation), and X-Forwarded-For added so the app sees the client's address (TRUSTED_PROXIES).
import { spawn } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { findBinary } from "./system.mjs";
import { waitForHttp } from "./app-instances.mjs";
import { freePort } from "./ports.mjs";

/** The configuration for a frontend on host:port over the given instances ({ name, port }). */
export function haproxyConfig({ host, port, apps, statsPort }) {
  return [
    "global",
    "  maxconn 2000",
    "defaults",
    "  mode http",
    "  option forwardfor",
    // A request whose connection to an instance failed is retried on another one at once (the
    // request never reached the app, so nothing ran twice).
    "  option redispatch 1",
    "  retries 2",
    "  timeout connect 2s",
    "  timeout client 120s",
    "  timeout server 120s",
    "  timeout http-request 30s",
    "  timeout check 3s",
    // HAProxy's own status page (which instances are in the rotation), on loopback only.
    "frontend stats",
    `  bind 127.0.0.1:${statsPort}`,
    "  stats enable",
    "  stats uri /",
    "  stats refresh 2s",
    "frontend web",
    `  bind ${host}:${port}`,
    "  default_backend apps",
    "backend apps",
    "  balance roundrobin",
    "  option httpchk GET /api/health",
    "  http-check expect status 200",
    // Checked every second; out after two failures, back after two successes.
    "  default-server inter 1s fall 2 rise 2",
    ...apps.map((a, i) => `  server ${a.name ?? `app${i + 1}`} 127.0.0.1:${a.port} check`),
    "",
  ].join("\n");
}

export async function startHaproxy({ port, apps, host = "127.0.0.1", dir }) {
  const bin = findBinary("haproxy");
  if (!bin) throw new Error("haproxy not found: apt-get install haproxy");
  dir = resolve(dir);
  mkdirSync(dir, { recursive: true });
  const cfg = join(dir, "haproxy.cfg");
  const statsPort = await freePort();
  writeFileSync(cfg, haproxyConfig({ host, port, apps, statsPort }));
  // -db: stay in the foreground, so the pid we keep is HAProxy's and a kill stops it.
  const child = spawn(bin, ["-db", "-f", cfg], { stdio: ["ignore", "ignore", "inherit"] });
  let exited = false;
  child.on("exit", () => {
    exited = true;
  });
  const shown = host === "0.0.0.0" ? "127.0.0.1" : host;
  const url = `http://${shown}:${port}`;
  async function stop() {
    if (exited) return;
    child.kill("SIGTERM");
    await new Promise((r) => {
      const t = setTimeout(r, 5000);
      child.once("exit", () => {
        clearTimeout(t);
        r();
      });
    });
    if (!exited) child.kill("SIGKILL");
  }
  try {
    await waitForHttp(`${url}/api/health`, 30_000, (r) => {
      if (exited) throw new Error(`HAProxy exited; check ${cfg}`);
      return r.status === 200;
    });
  } catch (err) {
    await stop();
    throw err;
  }
  const statsUrl = `http://127.0.0.1:${statsPort}/`;

  /** The instances HAProxy sends requests to now (their names), from its status page as CSV. */
  async function serversUp() {
    const csv = await (await fetch(`${statsUrl};csv`)).text();
    // Columns: pxname, svname, …, status (18th); one line per server.
    return csv
      .split("\n")
      .map((line) => line.split(","))
      .filter((f) => f[0] === "apps" && f[1] !== "BACKEND" && f[17] === "UP")
      .map((f) => f[1]);
  }

  /** Waits until HAProxy has the named instance in its rotation (two passed checks after a restart). */
  async function waitServerUp(name, timeoutMs = 60_000) {
    const until = Date.now() + timeoutMs;
    while (!(await serversUp()).includes(name)) {
      if (Date.now() > until) throw new Error(`HAProxy did not take ${name} back in ${timeoutMs / 1000} s`);
      await new Promise((r) => setTimeout(r, 250));
    }
  }
  return { url, statsUrl, pid: child.pid, config: cfg, serversUp, waitServerUp, stop };
}
