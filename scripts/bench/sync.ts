// `npm run bench:sync`: 10,000 readings through the real POST /api/sync handler (batches of 100,
// as a tablet sends them) against the same rows written by one raw multi-row INSERT with the
// mariadb connector, in the same run, on a throwaway MariaDB. Prints readings/s and the ratio.
// Target: handler ≥ 0.5 × raw. Benchmark data only (invented figures, scripts/bench/sync-readings.ts).
import { spawnSync } from "node:child_process";
import { cpus, loadavg } from "node:os";
import { measure, startDb } from "./bench-db";

const READINGS = Number(process.env.TW_BENCH_READINGS ?? 10_000);
const BATCH = Number(process.env.TW_BENCH_BATCH ?? 100);
const TAKEN_AT = "2026-11-30T08:00:00.000Z";

// Server modules import the "server-only" marker; run again with a tsconfig that maps it to a stub.
if (!process.env.TW_BENCH_CHILD) {
  const r = spawnSync(
    process.execPath,
    ["node_modules/tsx/dist/cli.mjs", "--tsconfig", "scripts/bench/tsconfig.sync.json", "scripts/bench/sync.ts"],
    {
      stdio: "inherit",
      env: { ...process.env, TW_BENCH_CHILD: "1", NODE_ENV: "production" },
    },
  );
  process.exit(r.status ?? 1);
}

const perSec = (n: number, ms: number) => Math.round((n * 1000) / ms);

const fmt = (n: number) => n.toLocaleString("en-US");

async function main() {
  const db = await startDb();
  try {
    const { setUp } = await import("./sync-setup");
    const { benchReadings, stationsPerJob } = await import("./sync-readings");
    // A quarter more jobs than full routes need: the stations no demo gauge can take are passed over.
    const perRun = Math.ceil((1.25 * READINGS) / stationsPerJob());
    const ctx = await setUp(perRun * 3 + 2);
    const [warmA, warmB, ...jobs] = ctx.jobIds;
    const [oneTablet, raw, fourTablets] = [0, 1, 2].map((i) => jobs.slice(i * perRun, (i + 1) * perRun));

    // Warm-up (connections, JIT, buffer pool), on jobs of their own.
    await ctx.pushAll(benchReadings([warmA], 200, TAKEN_AT, ctx.gauges), BATCH, 1);
    await ctx.rawInsert(await ctx.rowsLike(warmA, warmB));

    const readings = benchReadings(oneTablet, READINGS, TAKEN_AT, ctx.gauges);
    const q0 = await ctx.questions();
    const one = await measure(db.pid, () => ctx.pushAll(readings, BATCH, 1));
    const queries = ((await ctx.questions()) - q0) / Math.ceil(readings.length / BATCH);

    // The same rows (every column as the handler stored it) under fresh ids, in one statement.
    const rows = await ctx.rowsLikeMany(oneTablet, raw);
    const bare = await measure(db.pid, () => ctx.rawInsert(rows));

    // A shop has several tablets: the same amount again, four clients at once on their own jobs.
    const parallel = benchReadings(fourTablets, READINGS, TAKEN_AT, ctx.gauges);
    const four = await measure(db.pid, () => ctx.pushAll(parallel, BATCH, 4));

    const stored = await ctx.countReadings([...oneTablet, ...fourTablets]);
    if (stored !== readings.length + parallel.length || rows.length !== readings.length)
      throw new Error(`stored ${stored}, raw ${rows.length}, sent ${readings.length}`);
    const [h, r, p] = [
      perSec(readings.length, one.wall),
      perSec(rows.length, bare.wall),
      perSec(parallel.length, four.wall),
    ];
    const cpu = (m: typeof one) => `CPU: node ${m.node.toFixed(0)} ms, MariaDB ${m.db.toFixed(0)} ms`;
    console.log(
      `bench:sync  ${fmt(readings.length)} readings in batches of ${BATCH} over ${oneTablet.length} V8 jobs ` +
        `(${await ctx.countFlags(oneTablet)} flags opened), ${queries.toFixed(1)} queries per batch; ` +
        `load average ${loadavg()[0].toFixed(1)} on ${cpus().length} cores`,
    );
    console.log(
      `  POST /api/sync, one tablet  : ${fmt(h).padStart(7)} readings/s (${one.wall.toFixed(0)} ms; ${cpu(one)}; ` +
        "readings, verdicts, flags, audit and change feed)",
    );
    console.log(
      `  POST /api/sync, four tablets: ${fmt(p).padStart(7)} readings/s (${four.wall.toFixed(0)} ms; ${cpu(four)})`,
    );
    console.log(
      `  raw multi-row INSERT        : ${fmt(r).padStart(7)} readings/s (${bare.wall.toFixed(0)} ms; ${cpu(bare)}; ` +
        "the readings table only)",
    );
    console.log(
      `  ratio handler / raw         : ${(h / r).toFixed(2)} one tablet, ${(p / r).toFixed(2)} four tablets (target ≥ 0.50)`,
    );
    if (process.env.TW_BENCH_TRACE) ctx.printTrace();
    await ctx.close();
  } finally {
    await db.stop();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
