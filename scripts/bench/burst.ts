// `npm run bench:burst`: the end of a shift. 50 tablets each push one batch of 100 readings at the
// same moment; prints p50/p99 batch latency and readings/s for (a) one app instance on one MariaDB
// and (b) two instances behind HAProxy on a three-node Galera cluster, in the same run, each beside
// (c) raw multi-row INSERTs of the same rows on the same database, and what limited each. Goal: all
// acknowledged, p99 ≤ 2 s for (a) on a 2-core machine. Benchmark data only (invented figures).
import { randomUUID } from "node:crypto";
import { cpus, loadavg } from "node:os";
import type { Pool } from "mariadb";
import { READING_COLUMNS } from "@/lib/schemas/readings";
import type { PushReadingInput } from "@/lib/schemas/sync";
import { limitOf, measure, percentile, type Measured } from "./burst-measure";
import { lib } from "../soak/lib-types";
import { asPush, pushOnce, shopGauges, tabletPlan } from "../soak/plan";
import { clusterStack, exitAfterStopping, oneNodeStack, stopAllOnExit, type Stack } from "../soak/stack";
import { signIn } from "../soak/tablet";

const TABLETS = Number(process.env.TW_BURST_TABLETS ?? 50);
const BATCH = Number(process.env.TW_BURST_BATCH ?? 100);
const GOAL_P99_MS = 2_000;
const DEMO = { email: "rosa@kestrelflats.example", password: "bench-demo-2026" };
const COLUMNS = [...Object.values(READING_COLUMNS), "created_at", "updated_at"];
const log = (msg: string) => console.log(`[burst ${new Date().toISOString().slice(11, 19)}] ${msg}`);

type Row = Record<string, unknown>;

/** Job codes (make-jobs numbers them BURST-1 …): the burst's own (one per tablet), the raw inserts', the warm-up's. */
const KINDS = ["tab", "raw", "warm"] as const;
const codes = (kind: (typeof KINDS)[number]) =>
  Array.from({ length: TABLETS }, (_, i) => `BURST-${KINDS.indexOf(kind) * TABLETS + i + 1}`);

async function batchesFor(stack: Stack, cookie: string, kind: (typeof KINDS)[number]): Promise<PushReadingInput[][]> {
  const gauges = await shopGauges(stack.url, cookie, stack.jobs[codes(kind)[0]]);
  return codes(kind).map((c) => asPush(tabletPlan([stack.jobs[c]], BATCH, gauges)));
}

/** Every tablet signed in (its own session), then all batches sent at once. */
async function burstThroughApp(stack: Stack) {
  // Sign-in (bcrypt) happens at the start of the shift, not in the burst: done before it, in turn.
  const cookies: string[] = [];
  for (let i = 0; i < TABLETS; i++)
    cookies.push((await signIn(stack.url, stack.origin, DEMO.email, DEMO.password)).cookie);
  // Warm-up on jobs of their own: connections, JIT, the job context, as on a server that ran all day.
  for (const [i, batch] of (await batchesFor(stack, cookies[0], "warm")).slice(0, 4).entries())
    await pushOnce(stack.url, stack.origin, cookies[i], `warm-${i}`, batch);
  const batches = await batchesFor(stack, cookies[0], "tab");
  return async () => {
    const answers = await Promise.all(
      batches.map((b, i) => pushOnce(stack.url, stack.origin, cookies[i], `burst-tablet-${i + 1}`, b)),
    );
    return {
      latencies: answers.map((a) => a.ms),
      readings: batches.flat().length,
      acknowledged: answers.reduce((n, a) => n + (a.status === 200 ? a.accepted : 0), 0),
      failed: answers.filter((a) => a.status !== 200).length,
    };
  };
}

/** The burst's stored rows as new rows for the raw jobs, one 100-row INSERT per tablet, all at once. */
async function rawBurst(stack: Stack, pools: Pool[]) {
  const map = new Map(codes("tab").map((c, i) => [stack.jobs[c], stack.jobs[codes("raw")[i]]]));
  const rows: Row[] = await stack.nodes[0].pool.query(
    `SELECT ${COLUMNS.join(", ")} FROM readings WHERE job_id IN (?) ORDER BY job_id, taken_at, id`,
    [[...map.keys()]],
  );
  const perJob = [...map.keys()].map((from) =>
    rows
      .filter((r) => Number(r.job_id) === from)
      .map((r): Row => ({ ...r, id: randomUUID(), job_id: map.get(from), supersedes: null })),
  );
  const tuple = `(${COLUMNS.map(() => "?").join(",")})`;
  return async () => {
    const latencies = await Promise.all(
      perJob.map(async (batch, i) => {
        const t0 = performance.now();
        const sql = `INSERT INTO readings (${COLUMNS.join(",")}) VALUES ${batch.map(() => tuple).join(",")}`;
        await pools[i % pools.length].query(
          sql,
          batch.flatMap((r) => COLUMNS.map((c) => r[c])),
        );
        return performance.now() - t0;
      }),
    );
    const n = perJob.flat().length;
    return { latencies, readings: n, acknowledged: n, failed: 0 };
  };
}

async function configuration(label: string, stack: Stack): Promise<Measured[]> {
  const pids = { apps: stack.apps.apps.map((a) => a.pid), dbs: stack.dbPids() };
  const pools = stack.nodes.map((n) => n.pool);
  log(`${label}: ${TABLETS} tablets × ${BATCH} readings at once; load average ${loadavg()[0].toFixed(1)}`);
  const app = await measure(label, pids, pools, await burstThroughApp(stack));
  // The raw rows go through the first node only: the same writes without the app in between.
  const raw = await measure(`raw INSERT, ${label}`, pids, [pools[0]], await rawBurst(stack, pools.slice(0, 1)));
  return [app, raw];
}

function print(rows: { m: Measured; instances: number }[]) {
  console.log(`\nbench:burst  ${TABLETS} tablets × one batch of ${BATCH} readings at the same moment`);
  for (const { m, instances } of rows) {
    const rate = Math.round((m.acknowledged * 1000) / m.wallMs);
    console.log(
      `  ${m.label.padEnd(44)} p50 ${percentile(m.latencies, 50).toFixed(0).padStart(5)} ms  ` +
        `p99 ${percentile(m.latencies, 99).toFixed(0).padStart(5)} ms  ${String(rate).padStart(6)} readings/s  ` +
        `${m.acknowledged}/${m.readings} acknowledged; load average ${m.load.toFixed(1)} on ${cpus().length} cores`,
    );
    if (instances > 0) {
      // CPU time a batch moves far less with the machine's load than wall time: the figure to compare runs by.
      const cpu = (m.appCpuMs / m.batches).toFixed(1);
      const locks = `${m.db.Innodb_row_lock_waits ?? 0} row-lock waits (${m.db.Innodb_row_lock_time ?? 0} ms)`;
      console.log(`      app CPU ${cpu} ms a batch (${instances} instance(s)); ${locks}`);
      console.log(`      limited by ${limitOf(m, instances)}`);
    }
  }
}

async function main() {
  stopAllOnExit();
  const dist = (await lib()).ensureBuild({ perVersion: true });
  const jobs = KINDS.length * TABLETS;
  const base = { jobs, jobPrefix: "BURST", notifySeconds: 0 };
  const rows: { m: Measured; instances: number }[] = [];
  const one = await oneNodeStack({ ...base, label: "burst-one" }, dist);
  try {
    const [a, c] = await configuration("(a) one instance, one node", one);
    rows.push({ m: a, instances: 1 }, { m: c, instances: 0 });
  } finally {
    await one.stop();
  }
  // TW_BURST_ONLY=one: configuration (a) alone, for a quicker run while working on the one-node figure.
  if (process.env.TW_BURST_ONLY !== "one") {
    const cluster = await clusterStack({ ...base, apps: 2, label: "burst-cluster" }, dist);
    try {
      const [b, c] = await configuration("(b) two instances, Galera ×3, HAProxy", cluster);
      rows.push({ m: b, instances: 2 }, { m: c, instances: 0 });
    } finally {
      await cluster.stop();
    }
  }
  print(rows);
  const a = rows[0].m;
  const p99 = percentile(a.latencies, 99);
  console.log(
    `\n  goal (a): all acknowledged ${a.acknowledged === a.readings ? "yes" : "NO"}, ` +
      `p99 ${p99.toFixed(0)} ms ${p99 <= GOAL_P99_MS ? "≤" : ">"} ${GOAL_P99_MS} ms`,
  );
  const unacknowledged = rows.some(({ m }) => m.acknowledged !== m.readings);
  await exitAfterStopping(unacknowledged ? 1 : 0);
}

main().catch((err) => {
  console.error(err);
  void exitAfterStopping(1);
});
