// What bench:burst measures around one burst: wall time, each batch's latency, the CPU time the app
// and database processes used, and the database's own counters (commits, fsyncs, row-lock waits,
// Galera's certification failures and flow control), so the figures say what limited the burst.
import { readdirSync, readFileSync } from "node:fs";
import { cpus, loadavg } from "node:os";
import type { Pool } from "mariadb";

/**
 * A process's time so far, over all its threads (ms): on a CPU, and ready to run but waiting for one
 * (the kernel's schedstat), which is what other processes on a busy machine cost it. 0 once it is gone.
 */
export function schedMs(pid: number): { run: number; wait: number } {
  const out = { run: 0, wait: 0 };
  try {
    for (const task of readdirSync(`/proc/${pid}/task`)) {
      const [run, wait] = readFileSync(`/proc/${pid}/task/${task}/schedstat`, "utf8").split(" ").map(Number);
      out.run += run / 1e6;
      out.wait += wait / 1e6;
    }
  } catch {
    /* gone, or a thread ended while we read */
  }
  return out;
}

const COUNTERS = [
  "Com_commit",
  "Innodb_data_fsyncs",
  "Innodb_row_lock_waits",
  "Innodb_row_lock_time",
  "Innodb_deadlocks",
  "wsrep_local_cert_failures",
  "wsrep_local_bf_aborts",
  "wsrep_flow_control_paused_ns",
  "Questions",
];

export type Counters = Record<string, number>;

export async function counters(pools: Pool[]): Promise<Counters> {
  const sum: Counters = {};
  for (const pool of pools) {
    const rows = (await pool.query("SHOW GLOBAL STATUS WHERE Variable_name IN (?)", [COUNTERS])) as {
      Variable_name: string;
      Value: string;
    }[];
    for (const r of rows) sum[r.Variable_name] = (sum[r.Variable_name] ?? 0) + Number(r.Value);
  }
  return sum;
}

/** Nearest-rank percentile (p in 0..100). */
export function percentile(values: number[], p: number): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))] ?? NaN;
}

export interface Measured {
  label: string;
  wallMs: number;
  latencies: number[];
  readings: number;
  acknowledged: number;
  batches: number;
  failedBatches: number;
  appCpuMs: number;
  /** Time the app's threads were ready to run but waited for a core (other processes had it). */
  appWaitMs: number;
  dbCpuMs: number;
  db: Counters;
  load: number;
}

/** Runs `burst` and returns what it cost; `apps` and `dbs` are the process ids to account. */
export async function measure(
  label: string,
  pids: { apps: number[]; dbs: number[] },
  pools: Pool[],
  burst: () => Promise<{ latencies: number[]; readings: number; acknowledged: number; failed: number }>,
): Promise<Measured> {
  const sum = (list: number[]) =>
    list.map(schedMs).reduce((a, s) => ({ run: a.run + s.run, wait: a.wait + s.wait }), { run: 0, wait: 0 });
  const c0 = await counters(pools);
  const [a0, d0] = [sum(pids.apps), sum(pids.dbs)];
  const t0 = performance.now();
  const r = await burst();
  const wallMs = performance.now() - t0;
  const [a1, d1] = [sum(pids.apps), sum(pids.dbs)];
  const c1 = await counters(pools);
  const db = Object.fromEntries(Object.keys(c1).map((k) => [k, c1[k] - (c0[k] ?? 0)]));
  return {
    label,
    wallMs,
    latencies: r.latencies,
    readings: r.readings,
    acknowledged: r.acknowledged,
    batches: r.latencies.length,
    failedBatches: r.failed,
    appCpuMs: a1.run - a0.run,
    appWaitMs: a1.wait - a0.wait,
    dbCpuMs: d1.run - d0.run,
    db,
    load: loadavg()[0],
  };
}

/**
 * What limited the burst, from where the time went: the app's CPU (one Node thread per instance),
 * the database's CPU, row-lock waits, fsyncs per commit, or Galera's certification and flow control.
 */
export function limitOf(m: Measured, appInstances: number): string {
  const appShare = m.appCpuMs / (m.wallMs * appInstances);
  const starved = m.appWaitMs / (m.wallMs * appInstances);
  const dbShare = m.dbCpuMs / (m.wallMs * cpus().length);
  const parts = [
    `app CPU ${m.appCpuMs.toFixed(0)} ms (${(m.appCpuMs / m.batches).toFixed(0)} ms a batch) = ` +
      `${(100 * appShare).toFixed(0)} % of the burst per instance`,
    `app waiting for a core ${m.appWaitMs.toFixed(0)} ms`,
    `database CPU ${m.dbCpuMs.toFixed(0)} ms`,
    `${m.db.Com_commit ?? 0} commits, ${m.db.Innodb_data_fsyncs ?? 0} fsyncs`,
    `${m.db.Innodb_row_lock_waits ?? 0} row-lock waits (${m.db.Innodb_row_lock_time ?? 0} ms)`,
    `${m.db.Innodb_deadlocks ?? 0} deadlocks`,
  ];
  if (m.db.wsrep_local_cert_failures !== undefined)
    parts.push(
      `${m.db.wsrep_local_cert_failures} certification failures, ` +
        `flow control paused ${((m.db.wsrep_flow_control_paused_ns ?? 0) / 1e6).toFixed(0)} ms`,
    );
  let verdict: string;
  if (appShare > 0.7) verdict = "the app's CPU: each instance's one JavaScript thread is busy for most of the burst";
  else if (appShare + starved > 0.7)
    verdict = "the app's CPU, shared with other processes: its thread was running or waiting for a core";
  else if ((m.db.Innodb_row_lock_time ?? 0) > m.wallMs * 0.5) verdict = "row-lock waits in the database";
  else if ((m.db.wsrep_flow_control_paused_ns ?? 0) / 1e6 > m.wallMs * 0.2) verdict = "Galera flow control";
  else if (dbShare > 0.5) verdict = "the database's CPU";
  else if (appShare + m.dbCpuMs / m.wallMs > 0.8 * cpus().length)
    verdict = `the machine's ${cpus().length} cores, shared by the app and the database`;
  else verdict = "waiting (commits, fsyncs, round trips), not CPU";
  return `${verdict}\n      (${parts.join("; ")})`;
}
