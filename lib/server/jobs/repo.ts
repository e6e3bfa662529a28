import "server-only";
import type { InferAttributes, Transaction } from "sequelize";
import type { JobStatus, SpecLimit } from "@/lib/domain";
import type { FlagState } from "@/lib/schemas/enums";
import type { JobSummary } from "@/lib/schemas/job";
import type { JsonObject } from "@/lib/schemas/json";
import type { StoredReading } from "@/lib/schemas/readings";
import type { Customer, Engine, Job, JobLimit } from "@/models";
import { models } from "@/lib/server/core/db";
import { notFound } from "@/lib/server/core/errors";
import { modelColumns, type ModelColumns } from "@/lib/server/core/sql-columns";
import { settleAll, sqlRows, utcDate } from "@/lib/server/core/sql-driver";
import { readRows, withReads, type Read } from "@/lib/server/core/sql-read";
import { JOB_FLAGS_INDEX } from "@/lib/server/flags/repo";
import { toEngineShape, toSpecLimit, type JobContext } from "@/lib/server/jobs/context";

// The jobs feature's only door to the database: jobs, their engines, their own limit snapshots
// and the counts the desk shows. Plain objects out; every query is scoped by the shop.

export type JobRow = InferAttributes<Job>;
export type EngineRow = InferAttributes<Engine>;
export type JobLimitRow = InferAttributes<JobLimit>;
export type CustomerRow = InferAttributes<Customer>;
/** A job with its customer's name and its engine, as the board lists them. */
export type JobWithParties = JobRow & { customerName: string; engine: EngineRow | null };
export type FlagCounts = Record<FlagState, number>;

const plain = <T extends object>(row: { get(o: { plain: true }): T }): T => row.get({ plain: true });

async function jobsWithNames(shopId: number, statuses?: readonly JobStatus[]): Promise<JobWithParties[]> {
  const { Customer, Engine, Job } = models();
  const rows = await Job.findAll({
    where: { shopId, ...(statuses ? { status: [...statuses] } : {}) },
    include: [
      { model: Customer, as: "customer" },
      { model: Engine, as: "engine" },
    ],
    order: [
      ["dueDate", "ASC"],
      ["id", "ASC"],
    ],
  });
  return rows.map((j) => {
    const { customer, engine, ...job } = plain<JobRow & { customer?: CustomerRow; engine?: EngineRow }>(j);
    return { ...job, customerName: customer?.name ?? "", engine: engine ?? null };
  });
}

export const summaryOf = (j: JobWithParties): JobSummary => ({
  id: j.id,
  code: j.code,
  title: j.title,
  status: j.status,
  unitSystem: j.unitSystem,
  dueDate: j.dueDate ?? null,
  customer: j.customerName,
  engine: j.engine?.description ?? "",
});

/** Every job of the shop, soonest due first (all of them, or those in `statuses`). */
export async function listJobs(shopId: number, statuses?: readonly JobStatus[]): Promise<JobSummary[]> {
  return (await jobsWithNames(shopId, statuses)).map(summaryOf);
}

/** A job of this shop, or a 404 that never reveals whether another shop has it. */
export async function getJobOrThrow(shopId: number, jobId: number, t?: Transaction): Promise<JobRow> {
  const job = await models().Job.findOne({ where: { id: jobId, shopId }, transaction: t });
  if (!job) throw notFound("Job");
  return plain<JobRow>(job);
}

/** The job's row locked for an edit inside `t` (writers of one job queue behind each other). */
export async function lockJobOrThrow(t: Transaction, shopId: number, jobId: number): Promise<JobRow> {
  const job = await models().Job.findOne({ where: { id: jobId, shopId }, transaction: t, lock: t.LOCK.UPDATE });
  if (!job) throw notFound("Job");
  return plain<JobRow>(job);
}

export async function getEngineOrThrow(engineId: number, t?: Transaction): Promise<EngineRow> {
  const engine = await models().Engine.findByPk(engineId, { transaction: t });
  if (!engine) throw notFound("Engine");
  return plain<EngineRow>(engine);
}

/**
 * A job of this shop with its engine shape and its own limit snapshot; 404 for any other shop. Read
 * through the driver (model instances cost more than the queries): in a transaction on its own
 * connection (the sync ingest loads one for every job it has not seen), both statements pipelined
 * behind whatever the caller issued before (a job lock); else on a pooled one.
 */
export async function loadJobContext(shopId: number, jobId: number, t?: Transaction): Promise<JobContext> {
  if (t) return jobContextOn((sql, values) => sqlRows(t, sql, values), shopId, jobId);
  return withReads((read) => jobContextOn(read, shopId, jobId));
}

// jobs and engines read through the driver (sql-read.ts) as Sequelize's plain rows would be.
type Columns = { job: ModelColumns<JobRow>; engine: ModelColumns<EngineRow>; limit: ModelColumns<JobLimitRow> };
let columns: Columns | null = null;
function jobEngineColumns(): Columns {
  columns ??= {
    job: modelColumns<JobRow>(models().Job.getAttributes(), "j"),
    engine: modelColumns<EngineRow>(models().Engine.getAttributes(), "e", "engine_"),
    limit: modelColumns<JobLimitRow>(models().JobLimit.getAttributes(), "l"),
  };
  return columns;
}

/** The job context's two statements issued together through `read` (sql-read.ts or a transaction's
 * connection), beside the caller's other reads. */
export async function jobContextOn(read: Read, shopId: number, jobId: number): Promise<JobContext> {
  const { job, engine, limit } = jobEngineColumns();
  const [rows, limits] = await settleAll([
    read(
      `SELECT ${job.list}, ${engine.list} FROM jobs j JOIN engines e ON e.id = j.engine_id
        WHERE j.id = ? AND j.shop_id = ?`,
      [jobId, shopId],
    ),
    read(`SELECT ${limit.list} FROM job_limits l WHERE l.job_id = ? ORDER BY l.sort_order, l.id`, [jobId]),
  ]);
  if (!rows.length) throw notFound("Job");
  const [jobRow, engineRow] = [job.read(rows[0]), engine.read(rows[0])];
  return {
    job: jobRow,
    engine: engineRow,
    shape: toEngineShape(engineRow, jobRow),
    spec: limits.map((l) => toSpecLimit(limit.read(l))),
  };
}

/** The job page's header beside its context: customer, template name and flag counts, on `read`'s connection. */
export async function jobHeaderOn(
  read: Read,
  shopId: number,
  jobId: number,
): Promise<{
  customer: Pick<CustomerRow, "name" | "email" | "phone"> | null;
  templateName: string | null;
  flags: FlagCounts;
}> {
  const [parties, counts] = await settleAll([
    read<{ name: string | null; email: string | null; phone: string | null; templateName: string | null }>(
      `SELECT c.name, c.email, c.phone, t.name AS templateName FROM jobs j
        LEFT JOIN customers c ON c.id = j.customer_id LEFT JOIN spec_templates t ON t.id = j.template_id
        WHERE j.id = ? AND j.shop_id = ?`,
      [jobId, shopId],
    ),
    read<{ state: FlagState; n: number }>(
      `SELECT state, COUNT(*) AS n FROM flags ${JOB_FLAGS_INDEX} WHERE shop_id = ? AND job_id = ? GROUP BY state`,
      [shopId, jobId],
    ),
  ]);
  const flags: FlagCounts = { open: 0, disposed: 0, closed: 0 };
  for (const r of counts) if (r.state in flags) flags[r.state] = Number(r.n);
  const p = parties[0];
  return {
    customer: p && p.name !== null ? { name: p.name, email: p.email, phone: p.phone } : null,
    templateName: p?.templateName ?? null,
    flags,
  };
}

/**
 * The shop's jobs among `ids` with their engines, by id (other shops' ids are simply absent): the
 * sync feed's headers and the kept progress counts (board/progress.ts) read them here.
 */
export async function jobsWithEngines(shopId: number, ids: number[]): Promise<{ job: JobRow; engine: EngineRow }[]> {
  if (ids.length === 0) return [];
  const { job, engine } = jobEngineColumns();
  const rows = await readRows(
    `SELECT ${job.list}, ${engine.list} FROM jobs j JOIN engines e ON e.id = j.engine_id
      WHERE j.shop_id = ? AND j.id IN (?) ORDER BY j.id`,
    [shopId, ids],
  );
  return rows.map((r) => ({ job: job.read(r), engine: engine.read(r) }));
}

/** Each job's own limits in spec order (jobs of the caller's shop only), through the driver. */
export async function jobSpecs(jobIds: number[]): Promise<Map<number, SpecLimit[]>> {
  const specs = new Map<number, SpecLimit[]>(jobIds.map((id) => [id, []]));
  if (!jobIds.length) return specs;
  const { limit } = jobEngineColumns();
  const rows = await readRows(
    `SELECT ${limit.list} FROM job_limits l WHERE l.job_id IN (?) ORDER BY l.sort_order, l.id`,
    [jobIds],
  );
  for (const row of rows) {
    const l = limit.read(row);
    specs.get(l.jobId)!.push(toSpecLimit(l));
  }
  return specs;
}

/** Replaces a job's limit snapshot and moves its spec revision on, inside `t`. */
export async function replaceJobLimitRows(
  t: Transaction,
  jobId: number,
  rows: Omit<JobLimitRow, "id" | "jobId" | "createdAt" | "updatedAt">[],
  specRevision: number,
): Promise<void> {
  const { Job, JobLimit } = models();
  await JobLimit.destroy({ where: { jobId }, transaction: t });
  await JobLimit.bulkCreate(
    rows.map((r) => ({ ...r, jobId })),
    { transaction: t },
  );
  await Job.update({ specRevision }, { where: { id: jobId }, transaction: t });
}

export async function saveJobBuildPlan(t: Transaction, jobId: number, plan: JsonObject): Promise<void> {
  await models().Job.update({ buildPlan: plan }, { where: { id: jobId }, transaction: t });
}

/** The fields the current-reading rule needs, of every reading of these jobs (of `shopId`). */
export async function readingChains(
  shopId: number,
  jobIds: number[],
): Promise<Pick<StoredReading, "id" | "jobId" | "stationId" | "supersedes" | "skipped" | "takenAt" | "receivedAt">[]> {
  if (!jobIds.length) return [];
  // Through the driver: the board's first look counts every reading of a page of jobs.
  const rows = await readRows<Record<string, unknown>>(
    `SELECT id, job_id AS jobId, station_id AS stationId, supersedes, skipped, taken_at AS takenAt,
       received_at AS receivedAt FROM readings WHERE shop_id = ? AND job_id IN (?)`,
    [shopId, jobIds],
  );
  return rows.map((r) => ({
    id: String(r.id),
    jobId: Number(r.jobId),
    stationId: String(r.stationId),
    supersedes: (r.supersedes as string | null) ?? null,
    skipped: Boolean(r.skipped),
    takenAt: utcDate(r.takenAt)!,
    receivedAt: utcDate(r.receivedAt)!,
  }));
}
