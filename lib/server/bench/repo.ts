import "server-only";
import { Op, QueryTypes } from "sequelize";
import { OPEN_JOB_STATUSES, isJobLocked, jobLockReason } from "@/lib/domain";
import type { SettingMaster } from "@/lib/schemas/bench-gauges";
import type { BenchJobHeader } from "@/lib/schemas/sync";
import { decimalToNumber } from "@/models";
import { getSequelize, models } from "@/lib/server/core/db";
import type { FlagRow } from "@/lib/server/reconcile/repo";
import type { EngineRow, JobRow } from "@/lib/server/jobs/repo";

// The bench feature's door to the database: jobs as the tablet sees them (header with status and
// lock, customer and engine names) with their open flag counts, and their flags. Plain objects out.

type JobWithNames = JobRow & { customer?: { name: string }; engine?: EngineRow };

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

// The job list and a pack show only these of the customer and the engine.
const include = () => [
  { model: models().Customer, as: "customer", attributes: ["name"] },
  { model: models().Engine, as: "engine", attributes: ["description"] },
];
const plainJob = (j: { get(o: { plain: true }): object }) => j.get({ plain: true }) as JobWithNames;

/** Jobs that take readings (jobLock: an open status, no lock), soonest due first, with the engine row. */
export async function openBenchJobs(shopId: number): Promise<JobWithNames[]> {
  // The query narrows by jobLock's clauses; the filter keeps jobLock the one judge.
  const jobs = await models().Job.findAll({
    where: { shopId, status: { [Op.in]: [...OPEN_JOB_STATUSES] }, lockedAt: null },
    include: include(),
    order: [
      ["dueDate", "ASC"],
      ["id", "ASC"],
    ],
  });
  return jobs.map(plainJob).filter((j) => !isJobLocked(j));
}

export async function jobWithNames(shopId: number, jobId: number): Promise<JobWithNames | null> {
  const job = await models().Job.findOne({ where: { id: jobId, shopId }, include: include() });
  return job ? plainJob(job) : null;
}

/** Headers of the shop's jobs among `ids` (other shops' ids are simply absent). */
export async function jobHeaders(shopId: number, ids: number[]): Promise<BenchJobHeader[]> {
  if (ids.length === 0) return [];
  const rows = await models().Job.findAll({ where: { shopId, id: { [Op.in]: ids } }, order: [["id", "ASC"]] });
  return rows.map((j) => toHeader(j.get({ plain: true })));
}

/** Per job, its flags not closed. */
export async function openFlagCounts(jobIds: number[]): Promise<Map<number, number>> {
  const out = new Map(jobIds.map((id) => [id, 0]));
  if (jobIds.length === 0) return out;
  const rows = await getSequelize().query<{ jobId: number; n: number }>(
    "SELECT job_id AS jobId, COUNT(*) AS n FROM flags WHERE job_id IN (?) AND state <> 'closed' GROUP BY job_id",
    { replacements: [jobIds], type: QueryTypes.SELECT },
  );
  for (const r of rows) out.set(Number(r.jobId), Number(r.n));
  return out;
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
  const rows = await getSequelize().query<FlagRow>(
    `SELECT ${FLAG_COLUMNS} FROM flags WHERE ${where.join(" AND ")} ORDER BY id`,
    { replacements: opts.ids ? [jobIds, opts.ids] : [jobIds], type: QueryTypes.SELECT },
  );
  for (const f of rows) {
    f.jobId = Number(f.jobId);
    f.shopId = Number(f.shopId);
    f.value = decimalToNumber(f.value)!;
    f.limitMin = decimalToNumber(f.limitMin);
    f.limitMax = decimalToNumber(f.limitMax);
    f.deviation = decimalToNumber(f.deviation);
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
