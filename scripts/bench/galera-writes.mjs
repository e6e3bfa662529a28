// `npm run bench:galera-writes`: which way the app instances should write to a Galera cluster,
// measured at the database. A shift-end burst (50 tablets, one transaction of 100 readings each)
// sent (a) all through node 1, the others standing by, and (b) spread over nodes 1 and 2, one per
// app instance; three kinds of batch: inserts only; inserts and the update of the job's own row
// (as the job's progress mark does; two tablets per job); inserts and one row every batch of the
// shop updates (a shop-wide counter). Prints p50/p99 per batch, readings/s and the certification
// conflicts (error 1213 at commit, retried as the app retries them), with the load average.
// Benchmark data only (invented values).
import { randomUUID } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { cpus, loadavg, tmpdir } from "node:os";
import { join } from "node:path";
import mariadb from "mariadb";
import { startGalera } from "../lib/galera.mjs";

const TABLETS = Number(process.env.TW_BURST_TABLETS ?? 50);
const BATCH = Number(process.env.TW_BURST_BATCH ?? 100);
const ROUNDS = Number(process.env.TW_BURST_ROUNDS ?? 2);
const ACCOUNT = { user: "bench", password: "bench-only-password" };

const SCHEMA = [
  "CREATE TABLE readings (id CHAR(36) PRIMARY KEY, job_id INT NOT NULL, station VARCHAR(40) NOT NULL," +
    " value_mm DECIMAL(10,4) NOT NULL, taken_at DATETIME(3) NOT NULL, KEY (job_id, taken_at))",
  "CREATE TABLE shop_changes (shop_id INT PRIMARY KEY, last_change BIGINT NOT NULL)",
  "INSERT INTO shop_changes VALUES (1, 0)",
  "CREATE TABLE job_marks (job_id INT PRIMARY KEY, stale TINYINT NOT NULL, touched_at DATETIME(3) NOT NULL)",
  `INSERT INTO job_marks SELECT seq, 0, NOW(3) FROM seq_1_to_${TABLETS}`,
];

// The write each batch makes beside its inserts (null: none); two tablets share a job.
const KINDS = [
  ["inserts only", null],
  [
    "+ the job's row",
    (tablet) => [`UPDATE job_marks SET stale = 1, touched_at = NOW(3) WHERE job_id = ?`, [tablet >> 1]],
  ],
  ["+ one shop-wide row", () => ["UPDATE shop_changes SET last_change = last_change + 1 WHERE shop_id = 1", []]],
];

const percentile = (xs, p) =>
  [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.ceil((p / 100) * xs.length) - 1)];

async function batch(pool, tablet, extra) {
  const rows = Array.from({ length: BATCH }, (_, i) => [
    randomUUID(),
    (tablet >> 1) + 1,
    `main bore ${(i % 5) + 1}`,
    (69.85 + i / 10_000).toFixed(4),
    new Date(Date.UTC(2026, 10, 30, 8, 0, 0, i)),
  ]);
  const t0 = performance.now();
  let conflicts = 0;
  for (;;) {
    const conn = await pool.getConnection();
    try {
      await conn.beginTransaction();
      await conn.batch("INSERT INTO readings VALUES (?, ?, ?, ?, ?)", rows);
      if (extra) await conn.query(...extra(tablet));
      await conn.commit();
      return { ms: performance.now() - t0, conflicts };
    } catch (err) {
      await conn.rollback().catch(() => {});
      // Galera reports a write set that lost certification as a deadlock: the whole batch again.
      if (err.errno !== 1213 || conflicts > 20) throw err;
      conflicts++;
    } finally {
      conn.release();
    }
  }
}

async function burst(label, pools, extra) {
  const load = loadavg()[0];
  const t0 = performance.now();
  const results = await Promise.all(
    Array.from({ length: TABLETS }, (_, i) => batch(pools[i % pools.length], i, extra)),
  );
  const wall = performance.now() - t0;
  const ms = results.map((r) => r.ms);
  return {
    label,
    p50: percentile(ms, 50),
    p99: percentile(ms, 99),
    rate: (TABLETS * BATCH * 1000) / wall,
    conflicts: results.reduce((n, r) => n + r.conflicts, 0),
    load,
  };
}

async function main() {
  const dir = mkdtempSync(join(tmpdir(), "tenthwise-galera-writes-"));
  const grants = [
    `CREATE USER IF NOT EXISTS '${ACCOUNT.user}'@'127.0.0.1' IDENTIFIED BY '${ACCOUNT.password}';`,
    `GRANT ALL ON bench.* TO '${ACCOUNT.user}'@'127.0.0.1';`,
  ];
  const galera = await startGalera({ dir, databases: ["bench"], accountStatements: grants });
  const pools = galera.nodes.map((n) =>
    mariadb.createPool({ host: "127.0.0.1", port: n.port, ...ACCOUNT, database: "bench", connectionLimit: 25 }),
  );
  try {
    await galera.sql(0, SCHEMA.join(";\n"), "bench");
    await burst("warm-up", [pools[0], pools[1]], null);
    const layouts = [
      ["(a) all writes through node 1", [pools[0]]],
      ["(b) instance 1 on node 1, instance 2 on node 2", [pools[0], pools[1]]],
    ];
    console.log(`\nbench:galera-writes  ${TABLETS} batches × ${BATCH} readings at once, ${ROUNDS} rounds each`);
    for (const [kind, extra] of KINDS)
      for (let round = 1; round <= ROUNDS; round++)
        for (const [layout, used] of layouts) {
          const r = await burst(`${layout}, ${kind}`, used, extra);
          console.log(
            `  ${r.label.padEnd(68)} p50 ${r.p50.toFixed(0).padStart(5)} ms  p99 ${r.p99.toFixed(0).padStart(5)} ms  ` +
              `${Math.round(r.rate).toString().padStart(6)} readings/s  ${String(r.conflicts).padStart(3)} conflicts` +
              `  (load average ${r.load.toFixed(1)} on ${cpus().length} cores)`,
          );
        }
  } finally {
    for (const p of pools) await p.end().catch(() => {});
    await galera.stop();
    rmSync(dir, { recursive: true, force: true });
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
