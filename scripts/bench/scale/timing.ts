// Timing and plan checks of bench:scale: each office query's server function beside the raw SQL
// a hand-tuned query on the same indexes runs, interleaved in the same run, and EXPLAIN of every
// SELECT the server function issued (captured from Sequelize's log).
import type { Connection } from "mariadb";
import { getSequelize } from "@/lib/server/core/db";

export type Case = { name: string; app: () => Promise<unknown>; raw: (c: Connection) => Promise<unknown> };
export type Timed = { name: string; app: number[]; raw: number[]; cold: number; findings: string[] };

/** Nearest-rank percentile (p in 0..100). */
export function percentile(values: number[], p: number): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))];
}

async function ms(fn: () => Promise<unknown>): Promise<number> {
  const t0 = performance.now();
  await fn();
  return performance.now() - t0;
}

/** Runs fn with Sequelize's log captured; answers the SELECT statements it issued. */
export async function capture(fn: () => Promise<unknown>): Promise<string[]> {
  const options = (getSequelize() as unknown as { options: { logging?: unknown } }).options;
  const before = options.logging;
  const seen: string[] = [];
  options.logging = (sql: string) => seen.push(sql.replace(/^Executing \([^)]*\): /, "").replace(/;\s*$/, ""));
  try {
    await fn();
  } finally {
    options.logging = before;
  }
  return seen.filter((s) => /^\s*SELECT/i.test(s));
}

type PlanRow = { table: string | null; type: string | null; rows: number | string | null; Extra: string | null };
// The tables that grow with the history: a scan or sort of all of one is what must not happen.
const BIG = /^(readings|flags|flag_dispositions|audit_events|sync_changes|jobs|engines|job_limits|job_progress)$/;

/** What EXPLAIN shows wrong with a statement: a full scan, or a filesort over many rows, of a big table. */
export async function explain(conn: Connection, sql: string): Promise<string[]> {
  const plan: PlanRow[] = await conn.query(`EXPLAIN ${sql}`);
  const out: string[] = [];
  for (const p of plan) {
    const rows = Number(p.rows ?? 0);
    if (!p.table || !BIG.test(p.table.replace(/`/g, ""))) continue;
    if (p.type === "ALL" && rows > 2000) out.push(`full scan of ${p.table} (~${rows} rows)`);
    else if (p.Extra?.includes("filesort") && rows > 20000) out.push(`filesort over ${p.table} (~${rows} rows)`);
  }
  return out;
}

/** Times a case: a cold first call, warm-up, then `n` runs of the server function and the raw SQL in turn. */
export async function timeCase(conn: Connection, c: Case, n: number): Promise<Timed> {
  const cold = await ms(c.app);
  const statements = await capture(c.app);
  await c.raw(conn);
  const app: number[] = [];
  const raw: number[] = [];
  for (let i = 0; i < n; i++) {
    app.push(await ms(c.app));
    raw.push(await ms(() => c.raw(conn)));
  }
  const findings: string[] = [];
  for (const s of statements) {
    for (const f of await explain(conn, s).catch((e: Error) => [`EXPLAIN failed: ${e.message.slice(0, 80)}`]))
      findings.push(`${f} in: ${s.replace(/\s+/g, " ").slice(0, 110)}…`);
  }
  return { name: c.name, app, raw, cold, findings };
}
