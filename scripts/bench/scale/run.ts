// The measuring half of bench:scale (started by scripts/bench/scale.ts with the services' env):
// loads the history, then times every office query beside its raw SQL and checks their plans.
// Writes what the HTTP half needs (shop, jobs, people) to $TW_DATA_ROOT/scale-subject.json.
import { writeFileSync } from "node:fs";
import { cpus, loadavg } from "node:os";
import { join } from "node:path";
import mariadb, { type Connection } from "mariadb";
import { closeSequelize } from "@/lib/server/core/db";
import { cases, type Subject } from "./cases";
import { loadScale, ownerUrl } from "./load";
import { percentile, timeCase, type Timed } from "./timing";

const READINGS = Number(process.env.TW_SCALE_READINGS ?? 1_000_000);
const RUNS = Number(process.env.TW_SCALE_RUNS ?? 30);
const WARMUP = Number(process.env.TW_SCALE_WARMUP ?? 10);
const SETTLE_MS = 240_000;
const GOAL_RATIO = 2;
const GOAL_P95 = 200;
// A raw query under 1 ms is counted as 1 ms: below that a ratio only measures the driver's fixed cost.
const RAW_FLOOR_MS = 1;
const load = () => `load ${loadavg()[0].toFixed(1)}`;
const f = (n: number) => n.toFixed(1).padStart(6);

function line(t: Timed): string {
  const [a50, a95, r50] = [percentile(t.app, 50), percentile(t.app, 95), percentile(t.raw, 50)];
  const ratio = a50 / Math.max(r50, RAW_FLOOR_MS);
  const ok = ratio <= GOAL_RATIO && a95 <= GOAL_P95;
  return (
    `  ${t.name.padEnd(50)} p50 ${f(a50)} p95 ${f(a95)} ms | raw p50 ${f(r50)} p95 ${f(percentile(t.raw, 95))} | ` +
    `ratio ${ratio.toFixed(1).padStart(4)} | first ${f(t.cold)} | ${ok ? "ok  " : "MISS"} [${load()}]\n` +
    `      CPU per call: app ${t.cpu.app.toFixed(2)} ms, raw ${t.cpu.raw.toFixed(2)} ms (this process)`
  );
}

// EXPLAIN's verdict of each side: the indexes of the big tables it uses, or what it scans or sorts.
function planLine(t: Timed): string {
  const side = (p: Timed["plans"]["app"]) =>
    p.findings.length
      ? `${p.findings.length} scan/filesort: ${p.findings.map((x) => x.split(" in: ")[0]).join("; ")}`
      : `no scan or filesort; indexes ${p.indexes.join(", ") || "none needed"}`;
  return `      EXPLAIN app ${side(t.plans.app)} | raw ${side(t.plans.raw)}`;
}

async function subject(summary: Awaited<ReturnType<typeof loadScale>>): Promise<Subject & { leadEmail: string }> {
  const shop = summary.shops[1] ?? summary.shops[0];
  const conn = await mariadb.createConnection(ownerUrl());
  try {
    const [job] = await conn.query(
      `SELECT j.id FROM jobs j WHERE j.shop_id = ? AND j.status = 'closed'
        ORDER BY (SELECT COUNT(*) FROM flags f WHERE f.job_id = j.id) DESC, j.id DESC LIMIT 1`,
      [shop.id],
    );
    const held = await conn.query(
      "SELECT id FROM jobs WHERE shop_id = ? ORDER BY status = 'measuring' DESC, id DESC LIMIT 5",
      [shop.id],
    );
    const [span] = await conn.query(
      `SELECT DATE_FORMAT(MIN(created_at) + INTERVAL (TIMESTAMPDIFF(SECOND, MIN(created_at), MAX(created_at)) / 4) SECOND,
           '%Y-%m-%d') AS from_day,
         DATE_FORMAT(MAX(created_at) - INTERVAL (TIMESTAMPDIFF(SECOND, MIN(created_at), MAX(created_at)) / 4) SECOND,
           '%Y-%m-%d') AS to_day
       FROM audit_events WHERE shop_id = ?`,
      [shop.id],
    );
    return {
      auditDays: [span.from_day, span.to_day],
      shopId: shop.id,
      machinist: shop.people.find((p) => p.role === "machinist")!,
      jobId: Number(job.id),
      heldJobs: held.map((h: { id: number }) => Number(h.id)),
      leadEmail: shop.people.find((p) => p.role === "lead")!.email,
    };
  } finally {
    await conn.end();
  }
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * Waits, at most SETTLE_MS, until InnoDB has purged the load's undo history and the machine's
 * 1-minute load has fallen below one busy core: figures taken while the database still purges a
 * million inserts, or while the sealing processes' load lingers, measure those, not the queries.
 */
async function settle(conn: Connection): Promise<string> {
  const started = Date.now();
  for (;;) {
    const [row] = await conn.query("SHOW GLOBAL STATUS LIKE 'Innodb_history_list_length'");
    const history = Number(row?.Value ?? 0);
    const quiet = history < 1000 && loadavg()[0] < 1.5;
    const waited = Date.now() - started;
    if (quiet || waited >= SETTLE_MS)
      return `${quiet ? "settled" : "still busy"} after ${(waited / 1000).toFixed(0)} s (undo history ${history})`;
    await sleep(2000);
  }
}

async function main() {
  const machine = `load average ${loadavg()
    .map((l) => l.toFixed(1))
    .join(" ")} on ${cpus().length} cores`;
  console.log(`bench:scale  loading ${READINGS.toLocaleString("en-US")} readings [${machine}]`);
  const summary = await loadScale({ readings: READINGS, log: (l) => console.log(l) });
  console.log(
    `  loaded ${summary.readings.toLocaleString("en-US")} readings over ${summary.jobs} jobs in ` +
      `${summary.shops.length} shops in ${(summary.ms / 1000).toFixed(0)} s [${load()}]`,
  );
  const s = await subject(summary);
  writeFileSync(join(process.env.TW_DATA_ROOT ?? "/tmp", "scale-subject.json"), JSON.stringify(s));
  const conn = await mariadb.createConnection(ownerUrl());
  console.log(`  waiting for the database and the machine to settle: ${await settle(conn)} [${load()}]`);
  const [counts] = await conn.query(
    `SELECT (SELECT COUNT(*) FROM flags) AS flags, (SELECT COUNT(*) FROM audit_events) AS audits,
            (SELECT COUNT(*) FROM sync_changes) AS changes, (SELECT COUNT(*) FROM readings WHERE job_id = ?) AS jobReadings`,
    [s.jobId],
  );
  console.log(
    `  ${counts.flags} flags, ${counts.audits} audit events, ${counts.changes} change-feed rows; the measured job ` +
      `has ${counts.jobReadings} readings. Server function vs raw SQL, ${RUNS} runs each, interleaved, ` +
      `after ${WARMUP} untimed ` +
      `(goal: ratio ≤ ${GOAL_RATIO} and p95 ≤ ${GOAL_P95} ms):`,
  );
  const findings: string[] = [];
  let missed = 0;
  // TW_SCALE_CASES=flag,audit times only the cases whose names contain one of these words (a quick look).
  const only = process.env.TW_SCALE_CASES?.split(",").filter(Boolean);
  const chosen = cases(s).filter((c) => !only || only.some((w) => c.name.includes(w)));
  for (const c of chosen) {
    const t = await timeCase(conn, c, RUNS, WARMUP);
    const out = line(t);
    if (out.includes("MISS")) missed++;
    console.log(out);
    console.log(planLine(t));
    findings.push(...t.findings.map((x) => `  ${t.name}: ${x}`));
    findings.push(...t.plans.raw.findings.map((x) => `  ${t.name} (raw): ${x}`));
  }
  console.log(
    findings.length
      ? `EXPLAIN found ${findings.length}:\n${findings.join("\n")}`
      : "EXPLAIN: every statement uses an index; no whole-table scan or large filesort",
  );
  console.log(`${missed} of ${chosen.length} queries miss the goal [${load()}]`);
  await conn.end();
  await closeSequelize();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
