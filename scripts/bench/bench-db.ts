// The throwaway MariaDB of the in-process sync benches (bench:sync, burst-profile.ts), and the CPU
// time both processes use around a measured step.
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { randomBytes } from "node:crypto";
import { tmpdir } from "node:os";
import { join } from "node:path";

type Services = {
  startMariaDb(o: {
    dataDir: string;
    port: number;
    databases: string[];
    accountStatements: string[];
    throwaway: boolean;
  }): Promise<{
    urlFor(d: string, a: { user: string; password: string }): string;
    pid: number;
    socket: string;
    stop(): Promise<void>;
  }>;
  accountStatements(p: { databases: string[]; ownerPassword: string; appPassword: string }): string[];
  accountsEnv(db: unknown, database: string, p: { ownerPassword: string; appPassword: string }): Record<string, string>;
  freePort(): Promise<number>;
};

export async function startDb() {
  // The same private MariaDB the test runner starts (scripts/lib), on a free port, thrown away after.
  const lib = (name: string) => `../lib/${name}.mjs`;
  const { startMariaDb } = (await import(lib("mariadb"))) as Services;
  const { freePort } = (await import(lib("ports"))) as Services;
  const { accountStatements, accountsEnv } = (await import(lib("db-accounts"))) as Services;
  const dir = mkdtempSync(join(tmpdir(), "tenthwise-bench-"));
  const passwords = { ownerPassword: randomBytes(12).toString("hex"), appPassword: randomBytes(12).toString("hex") };
  const databases = ["tenthwise_bench"];
  const db = await startMariaDb({
    dataDir: join(dir, "mariadb"),
    port: await freePort(),
    databases,
    accountStatements: accountStatements({ databases, ...passwords }),
    throwaway: true,
  });
  // One process builds the fixture and measures: it runs as the owner (migrations and fixture
  // rows); the app account's table rights do not change what the measured SQL costs.
  const { DB_OWNER_USER, DB_OWNER_PASSWORD } = accountsEnv(db, databases[0], passwords);
  const url = db.urlFor(databases[0], { user: DB_OWNER_USER, password: DB_OWNER_PASSWORD });
  Object.assign(process.env, {
    DATABASE_URL: url,
    SESSION_SECRET: randomBytes(32).toString("hex"),
    DB_POOL_MAX: "10",
  });
  return {
    url,
    pid: db.pid,
    /** The server's socket, where root signs in without a password (lock diagnostics). */
    socket: db.socket,
    stop: async () => {
      await db.stop();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** CPU time (ms) used so far by this process and by the MariaDB server: wall clock on a busy machine is noisy. */
function cpuNow(dbPid: number): { node: number; db: number } {
  const [utime, stime] = readFileSync(`/proc/${dbPid}/stat`, "utf8")
    .split(") ")[1]
    .split(" ")
    .slice(11, 13)
    .map(Number);
  const u = process.cpuUsage();
  return { node: (u.user + u.system) / 1000, db: ((utime + stime) * 1000) / 100 };
}

/** Runs `fn`, returning wall ms and the CPU ms of both processes. */
export async function measure(dbPid: number, fn: () => Promise<unknown>) {
  const c0 = cpuNow(dbPid);
  const t0 = performance.now();
  await fn();
  const wall = performance.now() - t0;
  const c1 = cpuNow(dbPid);
  return { wall, node: c1.node - c0.node, db: c1.db - c0.db };
}
