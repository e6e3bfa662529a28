// `npm run cluster`: the app as it runs on several machines, on this one: three MariaDB Galera nodes
// (datadirs under .data/cluster/, kept between runs like npm start's .data/mariadb), the local
// fakes, the schema migrated and the demo seeded once, two app instances, and HAProxy on :3000
// (PORT honoured) in front of them. Ctrl-C or SIGTERM stops all of it.
import { readFileSync } from "node:fs";
import { ensureNodeModules } from "./lib/deps.mjs";
import { ensureSystemPackages } from "./lib/system.mjs";
import { portIsFree } from "./lib/ports.mjs";
import { localSecrets } from "./lib/secrets.mjs";

const PORT = Number(process.env.PORT ?? 3000);
const INSTANCES = Number(process.env.TW_INSTANCES ?? 2);

function printWhatRuns(stack) {
  const info = stack.info();
  const demo = JSON.parse(readFileSync("scripts/demo-accounts.json", "utf8"));
  const lines = [
    "",
    `  Tenthwise (cluster) is at http://localhost:${PORT}  (HAProxy, pid ${stack.proxy.pid})`,
    "",
    `  HAProxy's status page (which instances are in the rotation): ${info.proxyStats}`,
    "",
    "  Database nodes (MariaDB Galera):",
    ...info.nodes.map((n) => `    ${n.name}  127.0.0.1:${n.port}  pid ${n.pid}  socket ${n.socket}`),
    info.dbProxy
      ? `  The instances connect through HAProxy (TCP) 127.0.0.1:${info.dbProxy.port} to one Synced node, the writer:` +
        ` ${info.nodes[0].name}, then ${info.nodes[1].name} when it fails.`
      : "  Each instance connects to its own node.",
    "  App instances (next start):",
    ...info.apps.map(
      (a) => `    ${a.name}  ${a.url}  pid ${a.pid}${a.node === null ? "" : `  → ${info.nodes[a.node].name}`}`,
    ),
    "",
    "  Try a failover: `kill -9 <pid>` of a node or an instance. A killed writer's connections move to the",
    "  next node in about two seconds; a killed instance leaves HAProxy's rotation (it checks /api/health",
    "  every second). This script starts whatever was killed again after 10 s (a node rejoins by state",
    "  transfer, and the first node takes the writes back once it is Synced).",
    "",
    `  Demo sign-ins (demo only), password "${demo.password}":`,
    ...demo.accounts.map((a) => `    ${a.role.padEnd(10)} ${a.email}`),
    "",
    "  Ctrl-C stops the instances, HAProxy, the nodes and the local fakes.",
    "",
  ];
  console.log(lines.join("\n"));
}

// Like a service manager would: whatever dies is started again after a pause, so a failover can be
// watched both ways.
function supervise(stack, isStopping) {
  const RESTART_AFTER_MS = 10_000;
  const busy = new Set();
  const alive = (pid) => {
    try {
      process.kill(pid, 0);
      return true;
    } catch {
      return false;
    }
  };
  const timer = setInterval(() => {
    if (isStopping()) return;
    const targets = [
      ...stack.galera.nodes.map((n, i) => ({
        key: `node${i}`,
        pid: n.pid,
        what: n.name,
        again: () => stack.restartNode(i),
      })),
      ...stack.apps.apps.map((a, i) => ({
        key: `app${i}`,
        pid: a.pid,
        what: a.name,
        again: () => stack.restartApp(i),
      })),
    ];
    for (const t of targets) {
      if (busy.has(t.key) || alive(t.pid)) continue;
      busy.add(t.key);
      console.log(`[tenthwise] ${t.what} (pid ${t.pid}) is gone; starting it again in ${RESTART_AFTER_MS / 1000} s`);
      setTimeout(async () => {
        try {
          if (!isStopping()) await t.again();
          if (!isStopping()) console.log(`[tenthwise] ${t.what} is back`);
        } catch (err) {
          console.error(`[tenthwise] ${t.what} did not come back: ${err.message}`);
        } finally {
          busy.delete(t.key);
        }
      }, RESTART_AFTER_MS);
    }
  }, 1000);
  return () => clearInterval(timer);
}

async function main() {
  ensureNodeModules();
  ensureSystemPackages(["mariadbd", "galera", "rsync", "haproxy"]);
  if (!(await portIsFree(PORT))) throw new Error(`Port ${PORT} is busy. Stop what runs there or set PORT=…`);
  const { ensureBuild } = await import("./lib/build.mjs");
  const { startClusterStack } = await import("./lib/cluster-stack.mjs");
  const secrets = localSecrets();
  const distDir = ensureBuild();
  let stack = null;
  let stopping = null;
  let unsupervise = () => {};
  const shutdown = (code = 0) => {
    stopping ??= (async () => {
      console.log("\n[tenthwise] stopping the cluster …");
      unsupervise();
      await stack?.stop();
      process.exit(code);
    })();
    return stopping;
  };
  process.on("SIGINT", () => shutdown(0));
  process.on("SIGTERM", () => shutdown(0));
  try {
    stack = await startClusterStack({
      dataRoot: ".data/cluster",
      secrets,
      proxyPort: PORT,
      proxyHost: "0.0.0.0",
      instances: INSTANCES,
      distDir,
      extraEnv: { APP_URL: process.env.APP_URL ?? `http://localhost:${PORT}` },
    });
    if (stopping) return;
    unsupervise = supervise(stack, () => Boolean(stopping));
    printWhatRuns(stack);
  } catch (err) {
    console.error(`[tenthwise] ${err.message}`);
    await shutdown(1);
  }
}

main().catch((err) => {
  console.error(`[tenthwise] ${err.message}`);
  process.exit(1);
});
