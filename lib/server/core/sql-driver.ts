import "server-only";
import type { Transaction } from "sequelize";

// Hot-path SQL of POST /api/sync straight on the transaction's own mariadb connection (Sequelize v6
// keeps it on `transaction.connection`), so it stays inside the same transaction and job locks but
// skips Sequelize's query and row formatting, which cost more CPU than the queries (bench:sync).
//
// Pipelining: the driver sends a query as soon as it is issued, without waiting for the answers of
// the ones before (mariadb `pipelining`, on by default); the server still runs them one after the
// other, in order. Issuing several before awaiting them saves round trips; their order on the
// server is the order they were issued. Only reads may wait behind a write: if a statement dies in
// a deadlock, InnoDB rolls the whole transaction back and the next queued statement runs outside it
// (autocommit) — harmless for a read, a committed orphan for a write.
//
// Dates travel as UTC text both ways ('YYYY-MM-DD HH:MM:SS.mmm'): the driver would format and
// parse them in the Node process's local time zone, while the session runs at +00:00.

type DriverStream = NodeJS.EventEmitter & { close(): void };
export type DriverConnection = {
  query(opts: Record<string, unknown> & { sql: string }, values?: unknown[]): Promise<unknown>;
  queryStream(opts: Record<string, unknown> & { sql: string }, values?: unknown[]): DriverStream;
};
export type WriteResult = { affectedRows: number; insertId: number };

// Per-query options override the connection's (Sequelize's typeCast hook would parse each field).
const OPTIONS = {
  typeCast: undefined,
  decimalAsNumber: true,
  bigIntAsNumber: true,
  insertIdAsNumber: true,
  dateStrings: true,
  checkDuplicate: false,
};

// Rows as arrays of cells in the select list's order: the driver then builds no object per row,
// which for a reading's 28 columns is a third of its CPU (a caller builds one object literal instead).
const CELLS = { ...OPTIONS, rowsAsArray: true };
/** How a SELECT's rows come back: objects keyed by column name (the default), or arrays of cells. */
export type RowShape = "objects" | "cells";
const optionsFor = (shape: RowShape) => (shape === "cells" ? CELLS : OPTIONS);

function driverOf(t: Transaction): DriverConnection {
  const c = (t as unknown as { connection?: DriverConnection }).connection;
  if (!c) throw new Error("The transaction has no database connection yet");
  return c;
}

/** A Date as the DATETIME(3) text of its UTC time. */
export const utcText = (d: Date): string => d.toISOString().slice(0, 23).replace("T", " ");

const digits = (s: string, from: number, to: number) => {
  let n = 0;
  for (let i = from; i < to; i++) n = n * 10 + s.charCodeAt(i) - 48;
  return n;
};

/**
 * A DATETIME column read as text (UTC) back to a Date; null stays null. The server's own
 * "YYYY-MM-DD hh:mm:ss.fff" is read by position (a job page reads hundreds: a third of the cost
 * of parsing the text as a date); any other text is parsed as ISO 8601.
 */
export function utcDate(v: unknown): Date | null {
  if (v === null || v === undefined) return null;
  if (v instanceof Date) return v;
  const s = String(v);
  if (s.length === 23 && s[10] === " " && s[19] === "." && s[0] !== "0") {
    const [y, mo, d] = [digits(s, 0, 4), digits(s, 5, 7), digits(s, 8, 10)];
    return new Date(Date.UTC(y, mo - 1, d, digits(s, 11, 13), digits(s, 14, 16), digits(s, 17, 19), digits(s, 20, 23)));
  }
  return new Date(s.length <= 10 ? `${s}T00:00:00Z` : `${s.replace(" ", "T")}Z`);
}

/**
 * A listener for every statement run here (in a transaction or through sql-read.ts), its wall time
 * in ms and its values (bench:sync's TW_BENCH_TRACE; bench:scale EXPLAINs the reads it sees).
 */
type Trace = (sql: string, ms: number, values: unknown[]) => void;
let trace: Trace | null = null;
export const setSqlTrace = (fn: Trace | null) => void (trace = fn);

/** One statement on a driver connection, with this file's options (sql-read.ts runs its reads here too). */
export async function queryOn(
  c: DriverConnection,
  sql: string,
  values: unknown[],
  shape: RowShape = "objects",
): Promise<unknown> {
  const started = trace ? performance.now() : 0;
  const params = values.map(param);
  const out = await c.query({ sql, ...optionsFor(shape) }, params);
  trace?.(sql, performance.now() - started, params);
  return out;
}

/**
 * A SELECT's rows handed over one at a time (a job's whole history, never held at once). The
 * statement is issued at once, pipelined like any other; its rows wait on the connection (the
 * driver pauses the socket) until `each` is called, so a caller can first await the answers of
 * reads issued before it. Call `each` or `close` (which drops the rows), or the connection stays
 * paused.
 */
export type RowStream<R> = {
  /** Calls `onRow` for every row, in the order read; settles at the last row or the first error. */
  each(onRow: (row: R) => void): Promise<void>;
  close(): void;
};

export function streamOn<R>(
  c: DriverConnection,
  sql: string,
  values: unknown[],
  shape: RowShape = "objects",
): RowStream<R> {
  const started = trace ? performance.now() : 0;
  const params = values.map(param);
  const s = c.queryStream({ sql, ...optionsFor(shape) }, params);
  // The driver emits its errors whether or not anyone listens yet: keep the first for `each`.
  let failure: unknown = null;
  s.on("error", (e) => void (failure ??= e));
  return {
    each: (onRow) =>
      new Promise<void>((resolve, reject) => {
        const fail = (e: unknown) => {
          s.close();
          reject(e);
        };
        if (failure) return fail(failure);
        s.on("error", fail);
        s.on("data", (row: R) => {
          try {
            onRow(row);
          } catch (e) {
            fail(e);
          }
        });
        s.on("end", () => {
          trace?.(sql, performance.now() - started, params);
          resolve();
        });
      }),
    close: () => s.close(),
  };
}

const run = (t: Transaction, sql: string, values: unknown[], shape?: RowShape) =>
  queryOn(driverOf(t), sql, values, shape);

const param = (v: unknown) => (v === undefined ? null : v instanceof Date ? utcText(v) : v);

/** SELECT rows as plain objects, or arrays of cells (DECIMAL and BIGINT as numbers, DATETIME as UTC text). */
export async function sqlRows<T = Record<string, unknown>>(
  t: Transaction,
  sql: string,
  values: unknown[] = [],
  shape?: RowShape,
): Promise<T[]> {
  const rows = (await run(t, sql, values, shape)) as T[];
  return Array.isArray(rows) ? rows : [];
}

/** INSERT / UPDATE / DELETE; insertId is the first auto-increment id of a multi-row INSERT. */
export async function sqlWrite(t: Transaction, sql: string, values: unknown[] = []): Promise<WriteResult> {
  const r = (await run(t, sql, values)) as { affectedRows?: number; insertId?: number | bigint };
  return { affectedRows: Number(r.affectedRows ?? 0), insertId: Number(r.insertId ?? 0) };
}

/**
 * Awaits queries that were issued together (pipelined); throws the first failure, after every one
 * has settled, so none is left rejecting unobserved.
 */
export async function settleAll<T extends readonly unknown[]>(promises: { [K in keyof T]: Promise<T[K]> }): Promise<T> {
  const results = await Promise.allSettled(promises);
  const failed = results.find((r): r is PromiseRejectedResult => r.status === "rejected");
  if (failed) throw failed.reason;
  return results.map((r) => (r as PromiseFulfilledResult<unknown>).value) as unknown as T;
}
