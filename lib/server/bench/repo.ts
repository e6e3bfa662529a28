import "server-only";
import { Op } from "sequelize";
import { OPEN_JOB_STATUSES, isJobLocked, jobLockReason } from "@/lib/domain";
import type { SettingMaster } from "@/lib/schemas/bench-gauges";
import type { BenchJobHeader } from "@/lib/schemas/sync";
import { models } from "@/lib/server/core/db";
import { utcDate } from "@/lib/server/core/sql-driver";
import { modelColumns, type ModelColumns } from "@/lib/server/core/sql-columns";
import { readRows } from "@/lib/server/core/sql-read";
import type { FlagRow } from "@/lib/server/reconcile/repo";
import type { EngineRow, JobRow } from "@/lib/server/jobs/repo";

// The bench feature's door to the database: jobs as the tablet sees them (header with status and
// lock, customer and engine names) with their open flag counts, and their flags. Plain objects out.

type JobWithNames = JobRow & { customer?: { name: string }; engine?: Pick<EngineRow, "description"> };
/** A job the tablet may pick, with the flags on it not closed yet. */
export type BenchJobRow = JobWithNames & { openFlags: number };

export function toHeader(j: JobRow): BenchJobHeader {
  const lockReason = jobLockReason(j);
  return {
    id: j.id,
    code: j.code,
    title: j.title,
    status: j.status,
    unitSystem: j.unitSystem,
    locked: lockReason !== null,
    lockedAt: j.lockedAt ? new Date(j.lockedAt).toISOString() : null,
    lockReason,
    specRevision: j.specRevision,
    dueDate: j.dueDate ?? null,
  };
}

export const namesOf = (j: JobWithNames) => ({ customer: j.customer?.name ?? "", engine: j.engine?.description ?? "" });

// The job list and a pack show only these of the customer and the engine. Read through the driver
// (sql-read.ts): building model instances cost more than the query (bench:scale).
let jobColumns: ModelColumns<JobRow> | null = null;
function namedJobs(where: string, extra = "") {
  jobColumns ??= modelColumns<JobRow>(models().Job.getAttributes(), "j");
  const columns = jobColumns;
  return {
    sql: `SELECT ${columns.list}, c.name AS customerName, e.description AS engineDescription${extra}
      FROM jobs j JOIN customers c ON c.id = j.customer_id JOIN engines e ON e.id = j.engine_id WHERE ${where}`,
    read: (r: Record<string, unknown>): JobWithNames => ({
      ...columns.read(r),
      customer: { name: String(r.customerName) },
      engine: { description: String(r.engineDescription) },
    }),
  };
}

/**
 * Jobs that take readings (jobLock: an open status, no lock), soonest due first, each with its flags
 * not closed counted in the same statement.
 */
export async function openBenchJobs(shopId: number): Promise<BenchJobRow[]> {
  // The query narrows by jobLock's clauses; the filter keeps jobLock the one judge.
  const { sql, read } = namedJobs(
    "j.shop_id = ? AND j.status IN (?) AND j.locked_at IS NULL ORDER BY j.due_date, j.id",
    ", (SELECT COUNT(*) FROM flags f WHERE f.job_id = j.id AND f.state <> 'closed') AS openFlags",
  );
  const rows = await readRows(sql, [shopId, [...OPEN_JOB_STATUSES]]);
  return rows.map((r) => ({ ...read(r), openFlags: Number(r.openFlags) })).filter((j) => !isJobLocked(j));
}

export async function jobWithNames(shopId: number, jobId: number): Promise<JobWithNames | null> {
  const { sql, read } = namedJobs("j.id = ? AND j.shop_id = ?");
  const [row] = await readRows(sql, [jobId, shopId]);
  return row ? read(row) : null;
}

/** Headers of the shop's jobs among `ids` (other shops' ids are simply absent). */
export async function jobHeaders(shopId: number, ids: number[]): Promise<BenchJobHeader[]> {
  if (ids.length === 0) return [];
  const rows = await models().Job.findAll({ where: { shopId, id: { [Op.in]: ids } }, order: [["id", "ASC"]] });
  return rows.map((j) => toHeader(j.get({ plain: true })));
}

const FLAG_COLUMNS = `id, shop_id AS shopId, job_id AS jobId, reading_id AS readingId, derived_key AS derivedKey,
  station_id AS stationId, characteristic, value, unit, limit_min AS limitMin, limit_max AS limitMax, deviation,
  verdict, reason, state, disposition, operation, disposition_reason AS dispositionReason, disposed_at AS disposedAt,
  closed_at AS closedAt, closed_by_reading_id AS closedByReadingId, created_at AS createdAt`;

/**
 * Flags of these jobs (ids the caller has checked are the shop's), oldest first. Plain rows, not
 * model instances: a feed page carries hundreds and instances cost more than the query (bench:scale).
 */
export async function flagsOfJobs(
  jobIds: number[],
  opts: { ids?: number[]; unclosedOnly?: boolean } = {},
): Promise<FlagRow[]> {
  if (jobIds.length === 0 || opts.ids?.length === 0) return [];
  const where = [
    "job_id IN (?)",
    ...(opts.ids ? ["id IN (?)"] : []),
    ...(opts.unclosedOnly ? ["state <> 'closed'"] : []),
  ];
  const rows = await readRows<FlagRow>(
    `SELECT ${FLAG_COLUMNS} FROM flags WHERE ${where.join(" AND ")} ORDER BY id`,
    opts.ids ? [jobIds, opts.ids] : [jobIds],
  );
  // DECIMAL and BIGINT arrive as numbers; DATETIME as UTC text.
  for (const f of rows) {
    f.disposedAt = utcDate(f.disposedAt);
    f.closedAt = utcDate(f.closedAt);
    f.createdAt = utcDate(f.createdAt) as Date;
  }
  return rows;
}

/** The setting master registered with each of the shop's gauges that has one (for a study on the tablet). */
export async function settingMasters(shopId: number): Promise<Map<number, SettingMaster>> {
  const rows = await models().Instrument.findAll({
    where: { shopId, masterSize: { [Op.ne]: null } },
    attributes: ["id", "masterLabel", "masterSize", "masterU"],
  });
  return new Map(
    rows.map((g) => [g.id, { label: g.masterLabel ?? null, size: Number(g.masterSize), u: Number(g.masterU ?? 0) }]),
  );
}
