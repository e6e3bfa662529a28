// `npm run bench:sync`: 10,000 readings through the real POST /api/sync handler (batches of 100,
// as a tablet sends them) against the same rows written by one raw multi-row INSERT with the
// mariadb connector, in the same run, on a throwaway MariaDB. Prints readings/s and the ratio.
// Target: handler ≥ 0.5 × raw. Benchmark data only (invented figures, scripts/bench/sync-readings.ts).
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { randomBytes } from "node:crypto";
import { tmpdir } from "node:os";
import { join } from "node:path";

const READINGS = Number(process.env.TW_BENCH_READINGS ?? 10_000);
const BATCH = Number(process.env.TW_BENCH_BATCH ?? 100);
const TAKEN_AT = "2026-11-30T08:00:00.000Z";

// Server modules import the "server-only" marker; run again with a tsconfig that maps it to a stub.
if (!process.env.TW_BENCH_CHILD) {
  const r = spawnSync(process.execPath, ["node_modules/tsx/dist/cli.mjs", "--tsconfig", "scripts/bench/tsconfig.sync.json", "scripts/bench/sync.ts"], {
    stdio: "inherit", env: { ...process.env, TW_BENCH_CHILD: "1", NODE_ENV: "production" },
  });
  process.exit(r.status ?? 1);
}

type Services = {
  startMariaDb(o: { dataDir: string; port: number; database: string; user: string; password: string; throwaway: boolean }): Promise<{ url: string; stop(): Promise<void> }>;
  freePort(): Promise<number>;
};

async function startDb() {
  // The same private MariaDB the test runner starts (scripts/lib), on a free port, thrown away after.
  const lib = (name: string) => `../lib/${name}.mjs`;
  const { startMariaDb } = (await import(lib("mariadb"))) as Services;
  const { freePort } = (await import(lib("ports"))) as Services;
  const dir = mkdtempSync(join(tmpdir(), "tenthwise-bench-"));
  const password = randomBytes(12).toString("hex");
  const db = await startMariaDb({ dataDir: join(dir, "mariadb"), port: await freePort(), database: "tenthwise_bench", user: "tenthwise", password, throwaway: true });
  Object.assign(process.env, { DATABASE_URL: db.url, SESSION_SECRET: randomBytes(32).toString("hex"), DB_POOL_MAX: "10" });
  return { url: db.url, stop: async () => { await db.stop(); rmSync(dir, { recursive: true, force: true }); } };
}

const perSec = (n: number, ms: number) => Math.round((n * 1000) / ms);
const fmt = (n: number) => n.toLocaleString("en-US");

async function main() {
  const db = await startDb();
  try {
    const { setUp } = await import("./sync-setup");
    const { benchReadings, stationsPerJob } = await import("./sync-readings");
    const perRun = Math.ceil(READINGS / stationsPerJob());
    const ctx = await setUp(perRun * 3 + 2);
    const [warmA, warmB, ...jobs] = ctx.jobIds;
    const [oneTablet, raw, fourTablets] = [0, 1, 2].map((i) => jobs.slice(i * perRun, (i + 1) * perRun));

    // Warm-up (connections, JIT, buffer pool), on jobs of their own.
    await ctx.pushAll(benchReadings([warmA], 200, TAKEN_AT), BATCH, 1);
    await ctx.rawInsert(await ctx.rowsLike(warmA, warmB));

    const readings = benchReadings(oneTablet, READINGS, TAKEN_AT);
    const q0 = await ctx.questions();
    const t0 = performance.now();
    await ctx.pushAll(readings, BATCH, 1);
    const handlerMs = performance.now() - t0;
    const queries = ((await ctx.questions()) - q0) / Math.ceil(readings.length / BATCH);

    // The same rows (every column as the handler stored it) under fresh ids, in one statement.
    const rows = await ctx.rowsLikeMany(oneTablet, raw);
    const t1 = performance.now();
    await ctx.rawInsert(rows);
    const rawMs = performance.now() - t1;

    // A shop has several tablets: the same amount again, four clients at once on their own jobs.
    const parallel = benchReadings(fourTablets, READINGS, TAKEN_AT);
    const t2 = performance.now();
    await ctx.pushAll(parallel, BATCH, 4);
    const parallelMs = performance.now() - t2;

    const stored = await ctx.countReadings([...oneTablet, ...fourTablets]);
    if (stored !== readings.length + parallel.length || rows.length !== readings.length) throw new Error(`stored ${stored}, raw ${rows.length}, sent ${readings.length}`);
    const [h, r, p] = [perSec(readings.length, handlerMs), perSec(rows.length, rawMs), perSec(parallel.length, parallelMs)];
    console.log(`bench:sync  ${fmt(readings.length)} readings in batches of ${BATCH} over ${oneTablet.length} V8 jobs (${await ctx.countFlags(oneTablet)} flags opened), ${queries.toFixed(1)} queries per batch`);
    console.log(`  POST /api/sync, one tablet  : ${fmt(h).padStart(7)} readings/s (${handlerMs.toFixed(0)} ms; readings, verdicts, flags, audit and change feed)`);
    console.log(`  POST /api/sync, four tablets: ${fmt(p).padStart(7)} readings/s (${parallelMs.toFixed(0)} ms)`);
    console.log(`  raw multi-row INSERT        : ${fmt(r).padStart(7)} readings/s (${rawMs.toFixed(0)} ms; the readings table only)`);
    console.log(`  ratio handler / raw         : ${(h / r).toFixed(2)} one tablet, ${(p / r).toFixed(2)} four tablets (target ≥ 0.50)`);
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
