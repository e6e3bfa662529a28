import "server-only";
import { Op, QueryTypes } from "sequelize";
import { Customer, Engine, Job } from "@/models";
import { OPEN_JOB_STATUSES, isJobLocked, jobLockReason } from "@/lib/domain";
import type { BenchJobHeader } from "@/lib/schemas/sync";
import { getSequelize } from "@/lib/server/core/db";
import type { JobRow } from "@/lib/server/jobs/repo";

// Jobs as the tablet sees them: header (status, lock), customer and engine names, and progress.

type JobWithNames = Job & { customer?: Customer; engine?: Engine };

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

const include = [
  { model: Customer, as: "customer" },
  { model: Engine, as: "engine" },
];

/** Jobs that take readings (jobLock: an open status, no lock), soonest due first, with the engine row. */
export async function openBenchJobs(shopId: number): Promise<JobWithNames[]> {
  getSequelize();
  // The query narrows by jobLock's clauses; the filter keeps jobLock the one judge.
  const jobs = (await Job.findAll({
    where: { shopId, status: { [Op.in]: [...OPEN_JOB_STATUSES] }, lockedAt: null },
    include,
    order: [
      ["dueDate", "ASC"],
      ["id", "ASC"],
    ],
  })) as JobWithNames[];
  return jobs.filter((j) => !isJobLocked(j));
}

export async function jobWithNames(shopId: number, jobId: number): Promise<JobWithNames | null> {
  getSequelize();
  return (await Job.findOne({ where: { id: jobId, shopId }, include })) as JobWithNames | null;
}

/** Headers of the shop's jobs among `ids` (other shops' ids are simply absent). */
export async function jobHeaders(shopId: number, ids: number[]): Promise<BenchJobHeader[]> {
  if (ids.length === 0) return [];
  getSequelize();
  const rows = await Job.findAll({ where: { shopId, id: { [Op.in]: ids } }, order: [["id", "ASC"]] });
  return rows.map(toHeader);
}

/** Per job: stations with a figure, and flags not closed. */
export async function jobProgress(jobIds: number[]): Promise<Map<number, { readings: number; openFlags: number }>> {
  const out = new Map(jobIds.map((id) => [id, { readings: 0, openFlags: 0 }]));
  if (jobIds.length === 0) return out;
  const q = (sql: string) =>
    getSequelize().query<{ jobId: number; n: number }>(sql, { replacements: [jobIds], type: QueryTypes.SELECT });
  const [readings, flags] = await Promise.all([
    q(
      "SELECT job_id AS jobId, COUNT(DISTINCT station_id) AS n FROM readings WHERE job_id IN (?) AND skipped = 0 GROUP BY job_id",
    ),
    q("SELECT job_id AS jobId, COUNT(*) AS n FROM flags WHERE job_id IN (?) AND state <> 'closed' GROUP BY job_id"),
  ]);
  for (const r of readings) out.get(Number(r.jobId))!.readings = Number(r.n);
  for (const r of flags) out.get(Number(r.jobId))!.openFlags = Number(r.n);
  return out;
}
