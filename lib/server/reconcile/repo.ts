import "server-only";
import type { Transaction } from "sequelize";
import type { BenchFlag } from "@/lib/schemas/sync";
import { sqlRows, sqlWrite } from "@/lib/server/core/sql-driver";
import { insertMany } from "@/lib/server/core/sql-insert";

// The reconciler's one door to the database: flags as the bench and the reconciler see them,
// opened, re-evaluated and closed in raw SQL on the transaction's own connection (the sync hot
// path, bench:sync). The lead's decisions go through flags/repo.ts.

export type FlagRow = Omit<BenchFlag, "stations" | "revisit" | "disposedAt" | "closedAt" | "createdAt"> & {
  shopId: number;
  closedByReadingId: string | null;
  disposedAt: Date | null;
  closedAt: Date | null;
  createdAt: Date;
};
export type NewFlag = Pick<
  FlagRow,
  | "shopId"
  | "jobId"
  | "readingId"
  | "derivedKey"
  | "stationId"
  | "characteristic"
  | "value"
  | "unit"
  | "limitMin"
  | "limitMax"
  | "deviation"
  | "verdict"
  | "reason"
>;
export type FlagPatch = Partial<
  Pick<
    FlagRow,
    | "value"
    | "unit"
    | "limitMin"
    | "limitMax"
    | "deviation"
    | "verdict"
    | "reason"
    | "state"
    | "closedAt"
    | "closedByReadingId"
  >
>;

const UNCLOSED = `SELECT id, shop_id AS shopId, job_id AS jobId, reading_id AS readingId, derived_key AS derivedKey,
  station_id AS stationId, characteristic, value, unit, limit_min AS limitMin, limit_max AS limitMax, deviation,
  verdict, reason, state, disposition FROM flags WHERE job_id = ? AND state <> 'closed' ORDER BY id`;
export type UnclosedFlag = NewFlag & Pick<FlagRow, "id" | "state" | "disposition">;

/**
 * Flags of the job that are open or disposed. Every writer of a job's flags holds the job row's lock,
 * so the rows cannot change under us; `locking` only makes the read see the latest commit when the
 * caller's snapshot may predate that lock. (A locking range read would also take gap locks in the
 * flags index, which collide with inserts for neighbouring jobs: bench:sync saw deadlocks.)
 */
export async function unclosedFlags(t: Transaction, jobId: number, locking = true): Promise<UnclosedFlag[]> {
  const sql = locking ? `${UNCLOSED} LOCK IN SHARE MODE` : UNCLOSED;
  // The driver path returns DECIMAL and BIGINT as numbers already (sql-driver.ts).
  const rows = await sqlRows<UnclosedFlag>(t, sql, [jobId]);
  for (const r of rows) {
    r.id = Number(r.id);
    r.jobId = Number(r.jobId);
    r.shopId = Number(r.shopId);
  }
  return rows;
}

const NEW_COLUMNS: [string, keyof NewFlag][] = [
  ["shop_id", "shopId"],
  ["job_id", "jobId"],
  ["reading_id", "readingId"],
  ["derived_key", "derivedKey"],
  ["station_id", "stationId"],
  ["characteristic", "characteristic"],
  ["value", "value"],
  ["unit", "unit"],
  ["limit_min", "limitMin"],
  ["limit_max", "limitMax"],
  ["deviation", "deviation"],
  ["verdict", "verdict"],
  ["reason", "reason"],
];

/** One INSERT; returns the new ids in row order. */
export async function createFlags(t: Transaction, rows: NewFlag[]): Promise<number[]> {
  if (rows.length === 0) return [];
  const now = new Date();
  const firstId = await insertMany(
    t,
    "flags",
    [...NEW_COLUMNS.map(([c]) => c), "state", "created_at", "updated_at"],
    rows.map((r) => [...NEW_COLUMNS.map(([, k]) => r[k]), "open", now, now]),
  );
  // A multi-row INSERT takes consecutive auto-increment ids (InnoDB "simple insert").
  return rows.map((_, i) => firstId + i);
}

const PATCH_COLUMNS: Record<keyof FlagPatch, string> = {
  value: "value",
  unit: "unit",
  limitMin: "limit_min",
  limitMax: "limit_max",
  deviation: "deviation",
  verdict: "verdict",
  reason: "reason",
  state: "state",
  closedAt: "closed_at",
  closedByReadingId: "closed_by_reading_id",
};

export async function updateFlag(t: Transaction, id: number, patch: FlagPatch): Promise<void> {
  const keys = (Object.keys(patch) as (keyof FlagPatch)[]).filter((k) => patch[k] !== undefined);
  const sets = [...keys.map((k) => `${PATCH_COLUMNS[k]} = ?`), "updated_at = ?"];
  await sqlWrite(t, `UPDATE flags SET ${sets.join(", ")} WHERE id = ?`, [...keys.map((k) => patch[k]), new Date(), id]);
}
