// HAProxy (Debian's haproxy) in front of the app instances: HTTP, round robin, each instance checked
// with GET /api/health (a 503 there, e.g. its database node is not synced, takes it out of the
// rotation), and X-Forwarded-For added so the app sees the client's address (TRUSTED_PROXIES).
import { spawn } from "node:child_process";
import { connect } from "node:net";
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
    // Checked every second; out after two failures, back after two successes. A killed instance
    // refuses the connection and is out within two seconds; a busy one (a shift-end burst keeps its
    // one thread on sync batches) may take seconds to answer and is not dead, so the answer may take
    // up to 10 s before the check counts as failed, never leaving every instance out at once.
    "  timeout check 10s",
    "  default-server inter 1s fall 2 rise 2",
    ...apps.map((a, i) => `  server ${a.name ?? `app${i + 1}`} 127.0.0.1:${a.port} check`),
    "",
  ].join("\n");
}

// Runs HAProxy in the foreground (-db) on a configuration written to `dir/file`, so the pid kept is
// HAProxy's own and a kill stops it.
function runHaproxy(dir, file, text) {
  const bin = findBinary("haproxy");
  if (!bin) throw new Error("haproxy not found: apt-get install haproxy");
  dir = resolve(dir);
  mkdirSync(dir, { recursive: true });
  const config = join(dir, file);
  writeFileSync(config, text);
  const child = spawn(bin, ["-db", "-f", config], { stdio: ["ignore", "ignore", "inherit"] });
  let exited = false;
  child.on("exit", () => {
    exited = true;
  });
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
  return { pid: child.pid, config, exited: () => exited, stop };
}

export async function startHaproxy({ port, apps, host = "127.0.0.1", dir }) {
  const statsPort = await freePort();
  const {
    pid,
    config: cfg,
    exited,
    stop,
  } = runHaproxy(dir, "haproxy.cfg", haproxyConfig({ host, port, apps, statsPort }));
  const shown = host === "0.0.0.0" ? "127.0.0.1" : host;
  const url = `http://${shown}:${port}`;
  try {
    await waitForHttp(`${url}/api/health`, 30_000, (r) => {
      if (exited()) throw new Error(`HAProxy exited; check ${cfg}`);
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
  return { url, statsUrl, pid, config: cfg, serversUp, waitServerUp, stop };
}

/**
 * The database side (TCP): every connection to one Synced node at a time, the writer; the next node
 * takes over when it fails its check, and when the first is Synced again the connections move back
 * at once (never two writers for long). `checks[i].port`: node i's readiness responder
 * (node-check.mjs). The last node is left out while another is healthy: it is the rejoining nodes'
 * donor (galera.mjs), blocked while it serves a copy.
 */
export function dbProxyConfig({ port, nodes, checks }) {
  return [
    "global",
    "  maxconn 2000",
    "defaults",
    "  mode tcp",
    "  timeout connect 2s",
    "  timeout client 1h",
    "  timeout server 1h",
    "  timeout check 3s",
    "listen galera",
    `  bind 127.0.0.1:${port}`,
    "  option httpchk GET /",
    "  http-check expect status 200",
    "  default-server inter 1s fall 2 rise 3 on-marked-down shutdown-sessions",
    ...nodes.map((n, i) => {
      const role = i === 0 ? " on-marked-up shutdown-backup-sessions" : " backup";
      return `  server ${n.name} 127.0.0.1:${n.port} check port ${checks[i].port}${role}`;
    }),
    "",
  ].join("\n");
}

export async function startDbProxy({ nodes, checks, dir }) {
  const port = await freePort();
  const { pid, config, exited, stop } = runHaproxy(dir, "haproxy-db.cfg", dbProxyConfig({ port, nodes, checks }));
  const until = Date.now() + 15_000;
  while (!(await portIsOpen(port))) {
    if (exited()) throw new Error(`HAProxy (database) exited; check ${config}`);
    if (Date.now() > until) {
      await stop();
      throw new Error(`HAProxy (database) did not listen in 15 s; check ${config}`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  return { port, pid, config, stop };
}

function portIsOpen(port) {
  return new Promise((resolve) => {
    const socket = connect(port, "127.0.0.1");
    socket.once("connect", () => {
      socket.destroy();
      resolve(true);
    });
    socket.once("error", () => resolve(false));
  });
}
