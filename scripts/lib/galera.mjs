// A three-node MariaDB Galera cluster on 127.0.0.1 (Debian's mariadb-server and galera-4), each node
// with its own ports (SQL, group, incremental and full state transfer) and its own datadir under `dir`.
// The first node is made with mariadb-install-db and bootstraps the cluster; the others start empty
// and receive a full copy by rsync state transfer. Nodes run as the mysql user when we are root:
// rsync's transfer daemon drops to an unprivileged user and must reach the joiner's datadir.
import { spawn } from "node:child_process";
import { chmodSync, existsSync, mkdirSync, statSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { findBinary } from "./system.mjs";
import { freePort } from "./ports.mjs";
import {
  alive,
  isRoot,
  nodeArgs,
  nodeSql,
  ownByMysql,
  pickBootstrap,
  PROVIDER,
  run,
  sleep,
  stopLeftover,
  waitFor,
  wsrepState,
} from "./galera-node.mjs";

export { nodeSql, wsrepState };

/**
 * Starts (or, on existing datadirs, restarts) a Galera cluster and waits until every node is Synced
 * in a cluster of `nodes`. Databases and accounts are made on the first node (Galera copies them).
 * `donor`: the node (index) a rejoining node takes its copy from by preference, by default the last
 * one (the spare: with two app instances on three nodes, none uses it); null for Galera's choice.
 */
export async function startGalera({
  dir,
  nodes: count = 3,
  databases = [],
  accountStatements = [],
  name = "tenthwise",
  donor = count - 1,
}) {
  dir = resolve(dir);
  if (!findBinary("mariadbd")) throw new Error("mariadbd not found: install Debian's mariadb-server");
  if (!existsSync(PROVIDER)) throw new Error("Galera is not installed: apt-get install galera-4 rsync");
  mkdirSync(dir, { recursive: true });
  if (isRoot) letMysqlReach(dir);
  // The error logs outside the datadirs (a full state transfer replaces a joiner's datadir), in a
  // folder the nodes may write to (they open their log after becoming the mysql user).
  mkdirSync(join(dir, "logs"), { recursive: true });
  ownByMysql(join(dir, "logs"));
  const nodes = [];
  for (let i = 0; i < count; i++) {
    const datadir = join(dir, `n${i + 1}`);
    const ports = [await freePort(), await freePort(), await freePort(), await freePort()];
    nodes.push({
      name: `n${i + 1}`,
      clusterName: name,
      datadir,
      socket: join(datadir, "mysqld.sock"),
      pidFile: join(datadir, "mysqld.pid"),
      errLog: join(dir, "logs", `n${i + 1}.err`),
      port: ports[0],
      groupPort: ports[1],
      istPort: ports[2],
      sstPort: ports[3],
      pid: null,
    });
  }
  for (const n of nodes) await stopLeftover(n);
  const fresh = !existsSync(join(nodes[0].datadir, "mysql"));
  if (fresh) {
    mkdirSync(nodes[0].datadir, { recursive: true });
    ownByMysql(nodes[0].datadir);
    await run("mariadb-install-db", [
      "--no-defaults",
      ...(isRoot ? ["--user=mysql"] : []),
      `--datadir=${nodes[0].datadir}`,
      "--auth-root-authentication-method=normal",
      "--skip-test-db",
      "--skip-name-resolve",
    ]);
  }
  const first = fresh ? 0 : pickBootstrap(nodes);
  // The node processes we started (kept apart from `nodes`, which callers may print or serialise).
  const children = nodes.map(() => null);
  const cluster = { nodes, kill, restart, stop, sql: (i, q, db) => nodeSql(nodes[i], q, db), state, urlFor };

  function launch(i, bootstrap) {
    const node = nodes[i];
    mkdirSync(node.datadir, { recursive: true });
    ownByMysql(node.datadir);
    const child = spawn(findBinary("mariadbd"), nodeArgs(node, nodes, bootstrap, nodes[donor]), { stdio: "ignore" });
    children[i] = child;
    node.pid = child.pid;
    child.on("exit", () => {
      if (children[i] === child) children[i] = null;
    });
  }

  async function waitSynced(i, timeoutMs = 120_000) {
    const node = nodes[i];
    await waitFor(
      `${node.name} Synced`,
      async () => {
        if (!children[i]) throw new Error(`Galera node ${node.name} exited; see ${node.errLog}`);
        const s = await wsrepState(node);
        return s?.state === "Synced";
      },
      timeoutMs,
      node.errLog,
    );
  }

  async function state(i) {
    return wsrepState(nodes[i]);
  }

  /** SIGKILL one node (no shutdown, as a crash or a pulled cable would). */
  async function kill(i) {
    const node = nodes[i];
    const pid = node.pid;
    if (alive(pid)) process.kill(pid, "SIGKILL");
    await waitFor(`${node.name} gone`, async () => !alive(pid), 10_000, node.errLog);
  }

  /** Starts a stopped or killed node again; it rejoins (incremental or full transfer) and is Synced. */
  async function restart(i) {
    if (children[i]) await kill(i);
    launch(i, false);
    await waitSynced(i);
  }

  async function stopNode(node) {
    const pid = node.pid;
    if (!alive(pid)) return;
    await run("mariadb-admin", ["--no-defaults", `--socket=${node.socket}`, "-uroot", "shutdown"]).catch(() => {});
    const until = Date.now() + 30_000;
    while (alive(pid) && Date.now() < until) await sleep(100);
    if (alive(pid)) process.kill(pid, "SIGKILL");
  }

  let stopping = null;
  /** Stops every node, one after another (the last one stopped can bootstrap the next start). */
  function stop() {
    stopping ??= (async () => {
      const order = nodes.map((_, i) => i).filter((i) => i !== first);
      for (const i of [...order, first]) await stopNode(nodes[i]);
    })();
    return stopping;
  }

  function urlFor(i, database, { user, password }) {
    const u = `${encodeURIComponent(user)}:${encodeURIComponent(password)}`;
    return `mariadb://${u}@127.0.0.1:${nodes[i].port}/${database}`;
  }

  try {
    launch(first, true);
    await waitSynced(first);
    // The joiners one at a time: each takes a full copy from a donor, which rsync serves slowly
    // when two ask at once on a small machine.
    for (let i = 0; i < count; i++)
      if (i !== first) {
        launch(i, false);
        await waitSynced(i);
      }
    await waitFor(
      `a cluster of ${count}`,
      async () => (await wsrepState(nodes[first]))?.size === count,
      30_000,
      nodes[first].errLog,
    );
    const sql = [
      ...databases.map(
        (d) => `CREATE DATABASE IF NOT EXISTS \`${d}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`,
      ),
      ...accountStatements,
      "FLUSH PRIVILEGES;",
    ].join("\n");
    if (databases.length || accountStatements.length) await nodeSql(nodes[first], sql);
  } catch (err) {
    await stop();
    throw err;
  }
  return cluster;
}

// The mysql user must pass through every folder above the datadirs; a temporary directory is made
// private (0700), so each folder of ours that others cannot pass gets o+x (not read).
function letMysqlReach(dir) {
  for (let d = dir; d !== dirname(d); d = dirname(d)) {
    const st = statSync(d);
    if (!(st.mode & 0o001) && st.uid === process.getuid()) chmodSync(d, (st.mode & 0o7777) | 0o011);
  }
}
