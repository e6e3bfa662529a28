// `npx tsx scripts/bench/burst-profile.ts`: the app's CPU time per batch of bench:burst's kind (one
// batch of 100 readings for a job not seen before), through the real POST /api/sync handler in this
// process on a throwaway MariaDB: first one batch at a time (CPU per batch, no contention), then all
// at once (as the burst sends them). CPU time hardly moves with the machine's load; wall time does.
// With TW_PROFILE=file.cpuprofile the one-at-a-time batches are recorded as a CPU profile (open it
// in DevTools or any .cpuprofile viewer). Benchmark data only (invented figures).
import { spawnSync } from "node:child_process";
import { writeFileSync } from "node:fs";
import { Session } from "node:inspector/promises";
import { cpus, loadavg } from "node:os";
import { measure, startDb } from "./bench-db";

const TABLETS = Number(process.env.TW_BURST_TABLETS ?? 50);
const BATCH = 100;
const WARM = 12;
const TAKEN_AT = "2026-11-30T08:00:00.000Z";

// Server modules import the "server-only" marker; run again with a tsconfig that maps it to a stub.
if (!process.env.TW_BENCH_CHILD) {
  const r = spawnSync(
    process.execPath,
    [
      "node_modules/tsx/dist/cli.mjs",
      "--tsconfig",
      "scripts/bench/tsconfig.sync.json",
      "scripts/bench/burst-profile.ts",
    ],
    { stdio: "inherit", env: { ...process.env, TW_BENCH_CHILD: "1", NODE_ENV: "production" } },
  );
  process.exit(r.status ?? 1);
}

async function profiled<T>(fn: () => Promise<T>): Promise<T> {
  const file = process.env.TW_PROFILE;
  if (!file) return fn();
  const session = new Session();
  session.connect();
  await session.post("Profiler.enable");
  await session.post("Profiler.setSamplingInterval", { interval: 200 });
  await session.post("Profiler.start");
  try {
    return await fn();
  } finally {
    const { profile } = await session.post("Profiler.stop");
    writeFileSync(file, JSON.stringify(profile));
    session.disconnect();
  }
}

async function main() {
  const db = await startDb();
  try {
    const { setUp } = await import("./sync-setup");
    const { benchReadings } = await import("./sync-readings");
    const ctx = await setUp(WARM + 2 * TABLETS);
    const oneBatchEach = (jobs: number[]) => jobs.flatMap((j) => benchReadings([j], BATCH, TAKEN_AT, ctx.gauges));
    const [warm, oneByOne, atOnce] = [
      ctx.jobIds.slice(0, WARM),
      ...[0, 1].map((i) => ctx.jobIds.slice(WARM + i * TABLETS, WARM + (i + 1) * TABLETS)),
    ];
    // Warm-up on jobs of their own: connections, JIT, buffer pool, as on a server that ran all day.
    await ctx.pushAll(oneBatchEach(warm.slice(0, 4)), BATCH, 1);
    await ctx.pushAll(oneBatchEach(warm.slice(4)), BATCH, 4);

    // Made before measuring: choosing each reading's gauge is the tablet's work, not the server's.
    const [first, second] = [oneBatchEach(oneByOne), oneBatchEach(atOnce)];
    const seq = await profiled(() => measure(db.pid, () => ctx.pushAll(first, BATCH, 1)));
    const load1 = loadavg()[0];
    const locks = () => Promise.all(["Innodb_row_lock_waits", "Innodb_row_lock_time"].map(ctx.globalStatus));
    const locks0 = await locks();
    const all = await measure(db.pid, () => ctx.pushAll(second, BATCH, TABLETS));
    const [waits, waitMs] = (await locks()).map((x, i) => x - locks0[i]);
    const load2 = loadavg()[0];
    const n = oneByOne.length;
    console.log(`burst-profile  ${n} batches of ${BATCH} readings, each for a job not seen before`);
    console.log(
      `  one at a time: app CPU ${(seq.node / n).toFixed(1)} ms a batch, MariaDB ${(seq.db / n).toFixed(1)} ms, ` +
        `wall ${(seq.wall / n).toFixed(0)} ms a batch; load average ${load1.toFixed(1)} on ${cpus().length} cores`,
    );
    console.log(
      `  all at once  : app CPU ${(all.node / n).toFixed(1)} ms a batch, MariaDB ${(all.db / n).toFixed(1)} ms, ` +
        `wall ${all.wall.toFixed(0)} ms for all; load average ${load2.toFixed(1)} on ${cpus().length} cores`,
    );
    console.log(`                 ${waits} row-lock waits (${waitMs} ms)`);
    const stored = await ctx.countReadings([...oneByOne, ...atOnce]);
    if (stored !== 2 * n * BATCH) throw new Error(`stored ${stored} of ${2 * n * BATCH} readings`);
    await ctx.close();
  } finally {
    await db.stop();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
