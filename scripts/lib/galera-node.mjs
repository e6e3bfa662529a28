// One Galera node's pieces: its command line, its state, root SQL over its socket, and the files in
// its datadir. Used by galera.mjs, which starts and stops the cluster.
import { execFile } from "node:child_process";
import { chownSync, existsSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { promisify } from "node:util";

export const run = promisify(execFile);
export const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
export const PROVIDER = "/usr/lib/galera/libgalera_smm.so";
export const isRoot = typeof process.getuid === "function" && process.getuid() === 0;

/** Runs SQL as root over the node's socket; resolves to stdout (tab-separated, no headers). */
export async function nodeSql(node, sql, database) {
  const args = ["--no-defaults", `--socket=${node.socket}`, "-uroot", "-N", "-B", "-e", sql];
  if (database) args.push(database);
  const { stdout } = await run("mariadb", args, { encoding: "utf8", timeout: 10_000 });
  return stdout;
}

/** The node's wsrep state: { size, state }, or null when it does not answer. */
export async function wsrepState(node) {
  try {
    const out = await nodeSql(
      node,
      "SHOW STATUS WHERE Variable_name IN ('wsrep_cluster_size', 'wsrep_local_state_comment')",
    );
    const v = Object.fromEntries(
      out
        .trim()
        .split("\n")
        .map((l) => l.split("\t")),
    );
    return { size: Number(v.wsrep_cluster_size), state: v.wsrep_local_state_comment };
  } catch {
    return null;
  }
}

export function alive(pid) {
  if (!pid) return false;
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

// The pid in a datadir's pid file, when that process is still a MariaDB server.
export function leftoverPid(node) {
  try {
    const pid = Number(readFileSync(node.pidFile, "utf8").trim());
    return pid && readFileSync(`/proc/${pid}/cmdline`, "utf8").includes("mariadbd") ? pid : null;
  } catch {
    return null;
  }
}

export function ownByMysql(path) {
  if (!isRoot) return;
  const { uid, gid } = mysqlIds();
  chownSync(path, uid, gid);
}

let ids;
function mysqlIds() {
  if (ids) return ids;
  const line = readFileSync("/etc/passwd", "utf8")
    .split("\n")
    .find((l) => l.startsWith("mysql:"));
  if (!line) throw new Error("No mysql user: install Debian's mariadb-server (it creates the user)");
  const [, , uid, gid] = line.split(":");
  ids = { uid: Number(uid), gid: Number(gid) };
  return ids;
}

export function nodeArgs(node, all, bootstrap, donor) {
  const gcomm = all.map((n) => `127.0.0.1:${n.groupPort}`).join(",");
  const provider = [
    `gmcast.listen_addr=tcp://127.0.0.1:${node.groupPort}`,
    `ist.recv_addr=127.0.0.1:${node.istPort}`,
    // A small write-set cache: enough for a short outage to rejoin by incremental transfer.
    "gcache.size=64M",
    "gcache.page_size=16M",
  ].join(";");
  return [
    "--no-defaults",
    ...(isRoot ? ["--user=mysql"] : []),
    `--datadir=${node.datadir}`,
    `--socket=${node.socket}`,
    `--pid-file=${node.pidFile}`,
    `--port=${node.port}`,
    "--bind-address=127.0.0.1",
    "--skip-networking=0",
    "--skip-name-resolve",
    `--log-error=${node.errLog}`,
    "--character-set-server=utf8mb4",
    "--collation-server=utf8mb4_unicode_ci",
    "--innodb-buffer-pool-size=48M",
    "--innodb-log-file-size=48M",
    "--performance-schema=OFF",
    "--max-connections=200",
    // What Galera needs: row-based replication, interleaved auto-increment locks, InnoDB, and
    // trigger creation while the binary log is on (the migrations create triggers).
    "--binlog-format=ROW",
    "--default-storage-engine=InnoDB",
    "--innodb-autoinc-lock-mode=2",
    "--log-bin-trust-function-creators=1",
    "--wsrep-on=ON",
    `--wsrep-provider=${PROVIDER}`,
    `--wsrep-cluster-name=${node.clusterName}`,
    `--wsrep-node-name=${node.name}`,
    `--wsrep-node-address=127.0.0.1:${node.groupPort}`,
    `--wsrep-cluster-address=gcomm://${gcomm}`,
    `--wsrep-provider-options=${provider}`,
    `--wsrep-sst-receive-address=127.0.0.1:${node.sstPort}`,
    "--wsrep-sst-method=rsync",
    // A donor is blocked while it serves a full copy (and out of sync while it serves either): the
    // preferred donor is the spare node that no app instance uses; the trailing comma lets Galera
    // pick another one when the spare is down.
    ...(donor && donor !== node ? [`--wsrep-sst-donor=${donor.name},`] : []),
    ...(bootstrap ? ["--wsrep-new-cluster"] : []),
  ];
}

// After all nodes stopped, the one that stopped last is marked safe to bootstrap; after a crash of
// all of them none is, and the one with the highest committed sequence number is made so.
export function pickBootstrap(nodes) {
  const states = nodes.map((n) => {
    const file = join(n.datadir, "grastate.dat");
    if (!existsSync(file)) return { seqno: -1, safe: false };
    const text = readFileSync(file, "utf8");
    return { seqno: Number(/seqno:\s*(-?\d+)/.exec(text)?.[1] ?? -1), safe: /safe_to_bootstrap:\s*1/.test(text) };
  });
  let i = states.findIndex((s) => s.safe);
  if (i < 0) {
    i = states.reduce((best, s, j) => (s.seqno > states[best].seqno ? j : best), 0);
    const file = join(nodes[i].datadir, "grastate.dat");
    if (existsSync(file))
      writeFileSync(file, readFileSync(file, "utf8").replace(/safe_to_bootstrap:\s*0/, "safe_to_bootstrap: 1"));
  }
  return i;
}

export async function waitFor(what, check, timeoutMs, errLog) {
  const until = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > until) throw new Error(`${what} did not happen in ${timeoutMs / 1000} s; see ${errLog}`);
    await sleep(200);
  }
}

// A node left running on this datadir by a crashed run: stop it before ours starts.
export async function stopLeftover(node) {
  const pid = leftoverPid(node);
  if (!pid) return;
  process.kill(pid, "SIGTERM");
  const until = Date.now() + 30_000;
  while (alive(pid) && Date.now() < until) await sleep(200);
  if (alive(pid)) process.kill(pid, "SIGKILL");
}
