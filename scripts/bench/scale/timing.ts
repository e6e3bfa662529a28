// Timing and plan checks of bench:scale: each office query's server function beside the raw SQL
// a hand-tuned query on the same indexes runs, interleaved in the same run, and EXPLAIN of every
// SELECT the server function issued (captured from Sequelize's log and the driver path's trace).
import { writeFileSync } from "node:fs";
import { Session } from "node:inspector/promises";
import { join } from "node:path";
import type { Connection } from "mariadb";
import { getSequelize } from "@/lib/server/core/db";
import { setSqlTrace } from "@/lib/server/core/sql-driver";

export type Case = { name: string; app: () => Promise<unknown>; raw: (c: Connection) => Promise<unknown> };
/** What EXPLAIN shows of one side's statements: what is wrong, and the indexes of big tables used. */
export type Plan = { findings: string[]; indexes: string[] };
export type Timed = {
  name: string;
  app: number[];
  raw: number[];
  cold: number;
  /** This process's CPU time per call (user + system, ms), averaged: what a busy machine does not change. */
  cpu: Record<"app" | "raw", number>;
  findings: string[];
  plans: Record<"app" | "raw", Plan>;
};

/** Nearest-rank percentile (p in 0..100). */
export function percentile(values: number[], p: number): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))];
}

async function ms(fn: () => Promise<unknown>, cpu?: { total: number }): Promise<number> {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  await fn();
  const took = performance.now() - t0;
  const c = process.cpuUsage(c0);
  if (cpu) cpu.total += (c.user + c.system) / 1000;
  return took;
}

/**
 * Runs fn with Sequelize's log and the driver path's trace (sql-driver.ts) captured; answers the
 * SELECT statements it issued, with their values (the driver's; Sequelize's come inlined).
 */
export async function capture(fn: () => Promise<unknown>): Promise<[string, unknown][]> {
  const options = (getSequelize() as unknown as { options: { logging?: unknown } }).options;
  const before = options.logging;
  const seen: [string, unknown][] = [];
  options.logging = (sql: string) =>
    seen.push([sql.replace(/^Executing \([^)]*\): /, "").replace(/;\s*$/, ""), undefined]);
  setSqlTrace((sql, _ms, values) => seen.push([sql, values]));
  try {
    await fn();
  } finally {
    options.logging = before;
    setSqlTrace(null);
  }
  return seen.filter(([s]) => /^\s*SELECT/i.test(s));
}

type PlanRow = {
  table: string | null;
  type: string | null;
  key: string | null;
  rows: number | string | null;
  Extra: string | null;
};
// EXPLAIN names a table by its alias, so every table is judged by its rows: a scan of more than a
// few thousand, or a filesort of more than a page's worth of thousands, is what must not happen.
const SCAN_ROWS = 2000;
const SORT_ROWS = 20000;

/** What EXPLAIN shows of a statement: a full scan, or a filesort over many rows, of a big table; the indexes used. */
export async function explain(conn: Connection, sql: string, args?: unknown): Promise<Plan> {
  const plan: PlanRow[] = await conn.query(`EXPLAIN ${sql}`, args);
  const out: Plan = { findings: [], indexes: [] };
  for (const p of plan) {
    const rows = Number(p.rows ?? 0);
    const table = p.table?.replace(/`/g, "") ?? "";
    if (p.key) out.indexes.push(p.key);
    // A derived table holds what its own inner SELECT (EXPLAINed on its own row) let through,
    // bounded by that SELECT's LIMIT: reading it whole is the plan, not a scan of a big table.
    if (table.startsWith("<derived")) continue;
    if (p.type === "ALL" && rows > SCAN_ROWS) out.findings.push(`full scan of ${table} (~${rows} rows)`);
    else if (p.Extra?.includes("filesort") && rows > SORT_ROWS)
      out.findings.push(`filesort over ${table} (~${rows} rows)`);
  }
  return out;
}

/** The SELECTs the raw side sends (through a connection that notes them), with their arguments. */
async function rawStatements(conn: Connection, c: Case): Promise<[string, unknown][]> {
  const seen: [string, unknown][] = [];
  const noting = new Proxy(conn, {
    get: (target, key) =>
      key === "query"
        ? (sql: string, args?: unknown) => (seen.push([sql, args]), target.query(sql, args))
        : Reflect.get(target, key),
  });
  await c.raw(noting);
  return seen.filter(([s]) => /^\s*SELECT/i.test(s));
}

async function planOf(conn: Connection, statements: [string, unknown][]): Promise<Plan> {
  const all: Plan = { findings: [], indexes: [] };
  for (const [sql, args] of statements) {
    const p = await explain(conn, sql, args).catch((e: Error) => ({
      findings: [`EXPLAIN failed: ${e.message.slice(0, 80)}`],
      indexes: [],
    }));
    all.findings.push(...p.findings.map((f) => `${f} in: ${sql.replace(/\s+/g, " ").slice(0, 110)}…`));
    all.indexes.push(...p.indexes);
  }
  return { findings: all.findings, indexes: [...new Set(all.indexes)] };
}

/** Times a case: a cold first call, warm-up, then `n` runs of the server function and the raw SQL in turn. */
export async function timeCase(conn: Connection, c: Case, n: number, warmup: number): Promise<Timed> {
  const cold = await ms(c.app);
  const statements = await capture(c.app);
  const raw: number[] = [];
  const plans = {
    app: await planOf(conn, statements),
    raw: await planOf(conn, await rawStatements(conn, c)),
  };
  // Untimed runs first, as a server that has been up a while has run them: the app's own code is
  // compiled by then (its first call is reported apart, as `cold`), and the raw side's rows are cached.
  for (let i = 0; i < warmup; i++) {
    await c.app();
    await c.raw(conn);
  }
  const app: number[] = [];
  const cpu = { app: { total: 0 }, raw: { total: 0 } };
  for (let i = 0; i < n; i++) {
    app.push(await ms(c.app, cpu.app));
    raw.push(await ms(() => c.raw(conn), cpu.raw));
  }
  const perCall = { app: cpu.app.total / n, raw: cpu.raw.total / n };
  await profileApp(c, n);
  return { name: c.name, app, raw, cold, cpu: perCall, findings: plans.app.findings, plans };
}

/**
 * TW_SCALE_PROFILE=dir: after the timed runs, `n` more calls of the server function recorded as a
 * CPU profile, dir/<case>.cpuprofile (DevTools; `npx tsx scripts/bench/profile-top.ts file` lists
 * the functions that took the most). Outside the timed runs, so the figures are not disturbed.
 */
async function profileApp(c: Case, n: number) {
  const dir = process.env.TW_SCALE_PROFILE;
  if (!dir) return;
  const session = new Session();
  session.connect();
  await session.post("Profiler.enable");
  await session.post("Profiler.setSamplingInterval", { interval: 100 });
  await session.post("Profiler.start");
  for (let i = 0; i < n; i++) await c.app();
  const { profile } = await session.post("Profiler.stop");
  session.disconnect();
  writeFileSync(join(dir, `${c.name.replace(/[^a-z0-9]+/gi, "-")}.cpuprofile`), JSON.stringify(profile));
}
