// The two set-ups the soak and the burst bench compare, each from nothing on free loopback ports:
// one app instance on one MariaDB (the same private server `npm test` starts), and app instances on a
// three-node Galera cluster behind HAProxy (scripts/lib: galera, app-instances, haproxy). Both are
// migrated and seeded with the demo shop, get the same extra V8 jobs, and send mail to the fake SMTP
// server. stop() removes every process and file; stopAllOnExit() makes Ctrl-C do the same.
import { execFile } from "node:child_process";
import { randomBytes } from "node:crypto";
import { chmodSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { inspect, promisify } from "node:util";
import mariadb, { type Pool } from "mariadb";
import { lib, type Apps, type Cluster, type Env } from "./lib-types";

const run = promisify(execFile);

export interface NodeHandle {
  name: string;
  /** Owner's connection pool to this node alone (checks query every node directly). */
  pool: Pool;
}

export interface Stack {
  /** Where tablets send: the one app, or HAProxy in front of the instances. */
  url: string;
  /** APP_URL's origin, which every change must name. */
  origin: string;
  nodes: NodeHandle[];
  jobs: Record<string, number>;
  mailDir: string;
  apps: Apps;
  cluster?: Cluster;
  /** Cluster only: restart a node or an instance and wait until HAProxy sends it requests again. */
  restartNode?(i: number): Promise<void>;
  restartApp?(i: number): Promise<void>;
  /** Process ids of the database servers (for the CPU each used). */
  dbPids(): number[];
  stop(): Promise<void>;
}

export interface StackOptions {
  jobs: number;
  jobPrefix: string;
  /** Notifier pass interval (0: no notifier). */
  notifySeconds: number;
  apps?: number;
  label: string;
}

const stops = new Set<() => Promise<void>>();
let exiting = false;

/** Stops every set-up still running, then ends the process with `code`. */
export async function exitAfterStopping(code: number): Promise<never> {
  if (!exiting) {
    exiting = true;
    for (const stop of [...stops].reverse()) await stop().catch(() => undefined);
  }
  process.exit(code);
}

/** Ctrl-C, a kill or a crash stops every set-up still running before the process ends. */
export function stopAllOnExit(): void {
  process.on("SIGINT", () => void exitAfterStopping(130));
  process.on("SIGTERM", () => void exitAfterStopping(143));
  process.on("uncaughtException", (err) => {
    console.error(err);
    void exitAfterStopping(1);
  });
  process.on("unhandledRejection", (reason) => {
    console.error("unhandled rejection:", inspect(reason, { depth: 4 }));
    void exitAfterStopping(1);
  });
}

const tsx = (flags: string[], script: string, args: string[], env: Env) =>
  run(process.execPath, ["node_modules/tsx/dist/cli.mjs", ...flags, script, ...args], {
    env: env as NodeJS.ProcessEnv,
    encoding: "utf8",
    maxBuffer: 16 << 20,
  });

function secrets() {
  const hex = (n: number) => randomBytes(n).toString("hex");
  return { SESSION_SECRET: hex(32), LINK_SECRET: hex(32), DB_APP_PASSWORD: hex(12), DB_OWNER_PASSWORD: hex(12) };
}

/** Migrates and seeds the demo (unless the cluster's own start did), then adds the jobs. */
async function seedAndMakeJobs(env: Env, o: StackOptions, seed: boolean): Promise<Record<string, number>> {
  if (seed)
    await tsx(["--conditions=react-server"], "scripts/db-setup.ts", ["--seed"], env).catch((e) => {
      throw new Error(`db-setup failed: ${e.stderr || e.message}`);
    });
  const args = ["--count", String(o.jobs), "--prefix", o.jobPrefix];
  const flags = ["--tsconfig", "scripts/bench/tsconfig.sync.json"];
  const { stdout } = await tsx(flags, "scripts/soak/make-jobs.ts", args, env);
  return JSON.parse(stdout.trim().split("\n").pop()!) as Record<string, number>;
}

function appEnv(base: Env, s: ReturnType<typeof secrets>, url: string, o: StackOptions, dist: string): Env {
  return {
    ...base,
    TW_DIST_DIR: dist,
    SESSION_SECRET: s.SESSION_SECRET,
    LINK_SECRET: s.LINK_SECRET,
    APP_URL: url,
    NOTIFY_INTERVAL_SECONDS: String(o.notifySeconds),
    MAIL_RETRY_BASE_SECONDS: "2",
  };
}

// On a Galera node a read waits until the node has applied every write the cluster committed before it.
const ownerPool = (port: number, database: string, password: string, galera = false) =>
  mariadb.createPool({
    host: "127.0.0.1",
    port,
    user: "tenthwise_owner",
    password,
    database,
    connectionLimit: 3,
    ...(galera ? { initSql: "SET SESSION wsrep_sync_wait = 1" } : {}),
  });

function tracked(stop: () => Promise<void>): () => Promise<void> {
  let done: Promise<void> | null = null;
  const once = () => (done ??= stop().finally(() => stops.delete(once)));
  stops.add(once);
  return once;
}

/** One app instance on one private MariaDB (with the fake SMTP and S3 the tests use). */
export async function oneNodeStack(o: StackOptions, distDir: string): Promise<Stack> {
  const { startServices, freePort, withoutOwnerAccount, startApps } = await lib();
  const dir = mkdtempSync(join(tmpdir(), `tenthwise-${o.label}-`));
  const s = secrets();
  const ports = [await freePort(), await freePort(), await freePort()];
  // "start" mode: a server as in production (every commit flushed to disk), unlike the tests' throwaway.
  const services = await startServices({
    mode: "start",
    dataRoot: dir,
    dbPort: ports[0],
    smtpPort: ports[1],
    s3Port: ports[2],
    secrets: s,
  });
  let apps: Apps | undefined;
  let pool: Pool | undefined;
  const stop = tracked(async () => {
    await pool?.end().catch(() => undefined);
    await apps?.stop();
    await services.stop();
    rmSync(dir, { recursive: true, force: true });
  });
  try {
    const env = { ...process.env, ...services.env, SESSION_SECRET: s.SESSION_SECRET, LINK_SECRET: s.LINK_SECRET };
    const jobs = await seedAndMakeJobs(env, o, true);
    const database = new URL(services.env.DATABASE_URL).pathname.slice(1);
    pool = ownerPool(ports[0], database, s.DB_OWNER_PASSWORD);
    // The instance's port is picked when it starts; its pages' origin is a name of its own.
    const origin = "http://tenthwise-one-node.localhost";
    apps = await startApps({ count: 1, env: appEnv(withoutOwnerAccount(env), s, origin, o, distDir) });
    return {
      url: apps.apps[0].url,
      origin,
      nodes: [{ name: "one node", pool }],
      jobs,
      mailDir: services.env.MAIL_DIR,
      apps,
      dbPids: () => [Number(readFileSync(join(dir, "mariadb", "mysqld.pid"), "utf8"))],
      stop,
    };
  } catch (err) {
    await stop();
    throw err;
  }
}

/** `apps` instances (instance i on node i mod 3) behind HAProxy on a three-node Galera cluster. */
export async function clusterStack(o: StackOptions, distDir: string): Promise<Stack> {
  const { startClusterStack, freePort } = await lib();
  const dir = mkdtempSync(join(tmpdir(), `tenthwise-${o.label}-`));
  // The nodes run as the mysql user, which must pass through this (private by default) folder.
  chmodSync(dir, 0o755);
  const s = secrets();
  const pools: Pool[] = [];
  let started: Awaited<ReturnType<typeof startClusterStack>> | undefined;
  const stop = tracked(async () => {
    for (const p of pools) await p.end().catch(() => undefined);
    await started?.stop();
    rmSync(dir, { recursive: true, force: true });
  });
  try {
    started = await startClusterStack({
      dataRoot: dir,
      secrets: s,
      proxyPort: await freePort(),
      instances: o.apps ?? 2,
      distDir,
      mode: "test",
      extraEnv: { NOTIFY_INTERVAL_SECONDS: String(o.notifySeconds), MAIL_RETRY_BASE_SECONDS: "2" },
      log: (line: string) => console.log(`[${o.label}] ${line}`),
    });
    const { galera, apps, proxy, env } = started;
    const jobs = await seedAndMakeJobs(env, o, false);
    const database = new URL(env.DATABASE_URL!).pathname.slice(1);
    for (const n of galera.nodes) pools.push(ownerPool(n.port, database, s.DB_OWNER_PASSWORD, true));
    return {
      url: proxy.url,
      origin: new URL(env.APP_URL!).origin,
      nodes: galera.nodes.map((n, i) => ({ name: n.name, pool: pools[i] })),
      jobs,
      mailDir: env.MAIL_DIR!,
      apps,
      cluster: galera,
      restartNode: started.restartNode,
      restartApp: started.restartApp,
      dbPids: () => galera.nodes.map((n) => n.pid ?? 0).filter(Boolean),
      stop,
    };
  } catch (err) {
    await stop();
    throw err;
  }
}
