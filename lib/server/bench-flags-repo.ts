import "server-only";
import { Op, type Transaction } from "sequelize";
import { Flag } from "@/models";
import type { BenchFlag } from "@/lib/schemas/sync";
import { getSequelize } from "./db";

// Flags as the bench and the reconciler see them. The lead's desk (dispositions) has its own
// repo; this one only opens, re-evaluates and closes flags, and reads them for the tablet.

export type FlagRow = Omit<BenchFlag, "stations" | "revisit" | "disposedAt" | "closedAt" | "createdAt"> & {
  shopId: number;
  closedByReadingId: string | null;
  disposedAt: Date | null;
  closedAt: Date | null;
  createdAt: Date;
};
export type NewFlag = Pick<FlagRow, "shopId" | "jobId" | "readingId" | "derivedKey" | "stationId" | "characteristic" | "value" | "unit" | "limitMin" | "limitMax" | "deviation" | "verdict" | "reason">;
export type FlagPatch = Partial<Pick<FlagRow, "value" | "unit" | "limitMin" | "limitMax" | "deviation" | "verdict" | "reason" | "state" | "closedAt" | "closedByReadingId">>;

const plain = (f: Flag): FlagRow => f.get({ plain: true }) as unknown as FlagRow;

/** Flags of the job that are open or disposed, locked for update by the caller's transaction. */
export async function unclosedFlags(t: Transaction, jobId: number): Promise<FlagRow[]> {
  getSequelize();
  const rows = await Flag.findAll({ where: { jobId, state: { [Op.ne]: "closed" } }, order: [["id", "ASC"]], transaction: t, lock: t.LOCK.UPDATE });
  return rows.map(plain);
}

export async function createFlags(t: Transaction, rows: NewFlag[]): Promise<FlagRow[]> {
  if (rows.length === 0) return [];
  getSequelize();
  // One INSERT; MariaDB hands back consecutive auto-increment ids for a multi-row insert
  // (innodb_autoinc_lock_mode ≤ 1 or a simple insert), which Sequelize maps onto the rows.
  const created = await Flag.bulkCreate(rows.map((r) => ({ ...r, state: "open" as const })), { transaction: t, hooks: false, validate: false });
  return created.map(plain);
}

export async function updateFlag(t: Transaction, id: number, patch: FlagPatch): Promise<void> {
  getSequelize();
  await Flag.update(patch, { where: { id }, transaction: t, hooks: false });
}

export async function flagsOfJobs(jobIds: number[], opts: { ids?: number[]; unclosedOnly?: boolean } = {}): Promise<FlagRow[]> {
  if (jobIds.length === 0 || opts.ids?.length === 0) return [];
  getSequelize();
  const rows = await Flag.findAll({
    where: {
      jobId: { [Op.in]: jobIds },
      ...(opts.ids ? { id: { [Op.in]: opts.ids } } : {}),
      ...(opts.unclosedOnly ? { state: { [Op.ne]: "closed" } } : {}),
    },
    order: [["id", "ASC"]],
  });
  return rows.map(plain);
}

const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);

/** `inputs` maps a derived key to the stations it is computed from (deriveReadings' recipe). */
export function toBenchFlag(f: FlagRow, inputs: Map<string, string[]>): BenchFlag {
  const stations = f.derivedKey ? (inputs.get(f.derivedKey) ?? [f.stationId]) : [f.stationId];
  return {
    id: f.id, jobId: f.jobId, readingId: f.readingId, derivedKey: f.derivedKey, stationId: f.stationId,
    characteristic: f.characteristic, value: f.value, unit: f.unit, limitMin: f.limitMin, limitMax: f.limitMax,
    deviation: f.deviation, verdict: f.verdict, reason: f.reason, state: f.state, disposition: f.disposition,
    operation: f.operation, dispositionReason: f.dispositionReason, disposedAt: iso(f.disposedAt),
    closedAt: iso(f.closedAt), createdAt: iso(f.createdAt) as string, stations,
    revisit: f.state === "disposed" && (f.disposition === "measure_again" || f.disposition === "machine_again"),
  };
}
