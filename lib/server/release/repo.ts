import "server-only";
import type { InferAttributes, Transaction } from "sequelize";
import type { EngineShape, GaugeStudySummary, SpecLimit } from "@/lib/domain";
import type { Flag, FlagDisposition, Instrument, Job, JobLimit, Release } from "@/models";
import type { JsonValue } from "@/lib/schemas/json";
import type { StoredReading } from "@/lib/schemas/readings";
import { models } from "@/lib/server/core/db";
import { notFound } from "@/lib/server/core/errors";
import type { Read } from "@/lib/server/core/sql-read";
import { latestSummaries } from "@/lib/server/gauge-studies/repo";
import { toEngineShape, toSpecLimit } from "@/lib/server/jobs/context";

// Everything the release checklist, the release hash and the release page read about one job,
// loaded in a handful of queries and returned as plain objects (numbers for DECIMALs, Dates).
export type JobRow = InferAttributes<Job>;
export type LimitRow = InferAttributes<JobLimit>;
export type FlagRow = InferAttributes<Flag>;
export type DispositionRow = InferAttributes<FlagDisposition>;
export type InstrumentRow = InferAttributes<Instrument>;
export type ReleaseRow = InferAttributes<Release>;

export type JobRecord = {
  job: JobRow;
  customerName: string;
  engineDescription: string;
  shape: EngineShape;
  spec: SpecLimit[];
  limits: LimitRow[];
  readings: StoredReading[];
  flags: FlagRow[];
  dispositions: DispositionRow[];
  /** The instruments any reading of the job was taken with. */
  instruments: InstrumentRow[];
  /** Each of those instruments' latest capability study (absent: none on file). */
  studies: Map<number, GaugeStudySummary>;
};

const plain = <T>(rows: { get(o: { plain: true }): unknown }[]) => rows.map((r) => r.get({ plain: true }) as T);

/**
 * A job of this shop with all its readings (current and superseded), limits, flags,
 * dispositions and gauges; 404 for another shop's job. `lock` takes the job row FOR UPDATE
 * (inside `t`), so a release and a reading for the same job cannot interleave.
 */
export async function loadJobRecord(shopId: number, jobId: number, t?: Transaction, lock = false): Promise<JobRecord> {
  const { Customer, Engine, Flag, FlagDisposition, Instrument, Job, JobLimit, Reading } = models();
  const job = await Job.findOne({
    where: { id: jobId, shopId },
    transaction: t,
    ...(lock && t ? { lock: t.LOCK.UPDATE } : {}),
  });
  if (!job) throw notFound("Job");
  const [engine, customer, limits, readings, flags] = await Promise.all([
    Engine.findByPk(job.engineId, { transaction: t }),
    Customer.findByPk(job.customerId, { transaction: t }),
    JobLimit.findAll({
      where: { jobId },
      order: [
        ["sortOrder", "ASC"],
        ["id", "ASC"],
      ],
      transaction: t,
    }),
    Reading.findAll({
      where: { jobId, shopId },
      order: [
        ["takenAt", "ASC"],
        ["id", "ASC"],
      ],
      transaction: t,
    }),
    Flag.findAll({ where: { jobId, shopId }, order: [["id", "ASC"]], transaction: t }),
  ]);
  if (!engine) throw notFound("Engine");
  const flagIds = flags.map((f) => f.id);
  const instrumentIds = [...new Set(readings.map((r) => r.instrumentId).filter((id): id is number => id !== null))];
  const [dispositions, instruments, studies] = await Promise.all([
    flagIds.length
      ? FlagDisposition.findAll({ where: { flagId: flagIds }, order: [["id", "ASC"]], transaction: t })
      : [],
    instrumentIds.length
      ? Instrument.findAll({ where: { id: instrumentIds, shopId }, order: [["id", "ASC"]], transaction: t })
      : [],
    latestSummaries(shopId, instrumentIds, t),
  ]);
  return {
    job: job.get({ plain: true }) as JobRow,
    customerName: customer?.name ?? "",
    engineDescription: engine.description,
    shape: toEngineShape(engine, job),
    spec: limits.map(toSpecLimit),
    limits: plain<LimitRow>(limits),
    readings: plain<StoredReading>(readings),
    flags: plain<FlagRow>(flags),
    dispositions: plain<DispositionRow>(dispositions),
    instruments: plain<InstrumentRow>(instruments),
    studies,
  };
}

/** Releases of a job, newest first. */
export async function listReleases(jobId: number, t?: Transaction): Promise<ReleaseRow[]> {
  const { Release } = models();
  const rows = await Release.findAll({
    where: { jobId },
    order: [
      ["signedAt", "DESC"],
      ["id", "DESC"],
    ],
    transaction: t,
  });
  return plain<ReleaseRow>(rows);
}

export async function activeRelease(jobId: number, t?: Transaction): Promise<ReleaseRow | null> {
  const { Release } = models();
  const row = await Release.findOne({ where: { jobId, voidedAt: null }, order: [["id", "DESC"]], transaction: t });
  return row ? (row.get({ plain: true }) as ReleaseRow) : null;
}

/** Whether a release of the job stands (activeRelease's question), on `read`'s connection beside other reads. */
export async function hasStandingReleaseOn(read: Read, jobId: number): Promise<boolean> {
  return (await read("SELECT id FROM releases WHERE job_id = ? AND voided_at IS NULL LIMIT 1", [jobId])).length > 0;
}

export async function findReleaseByHash(hash: string): Promise<(ReleaseRow & { jobCode: string }) | null> {
  const { Job, Release } = models();
  const row = await Release.findOne({ where: { hash }, order: [["id", "DESC"]] });
  if (!row) return null;
  const job = await Job.findOne({ where: { id: row.jobId, shopId: row.shopId } });
  return job ? { ...(row.get({ plain: true }) as ReleaseRow), jobCode: job.code } : null;
}

/** Display names of users, by id, within a shop. */
export async function userNames(
  shopId: number,
  ids: (number | null | undefined)[],
  t?: Transaction,
): Promise<Map<number, string>> {
  const { User } = models();
  const wanted = [...new Set(ids.filter((id): id is number => typeof id === "number"))];
  if (!wanted.length) return new Map();
  const users = await User.findAll({ where: { id: wanted, shopId }, attributes: ["id", "name"], transaction: t });
  return new Map(users.map((u) => [u.id, u.name]));
}

/** Where a customer's link points: the release's shop and job, or null for no such release. */
export async function findReleaseOwner(id: number): Promise<{ id: number; shopId: number; jobId: number } | null> {
  const { Release } = models();
  const r = await Release.findByPk(id);
  return r ? { id: r.id, shopId: r.shopId, jobId: r.jobId } : null;
}

/** The job row, locked FOR UPDATE inside `t`; 404 for another shop's job. */
export async function lockJob(t: Transaction, shopId: number, jobId: number) {
  const { Job } = models();
  const job = await Job.findOne({ where: { id: jobId, shopId }, transaction: t, lock: t.LOCK.UPDATE });
  if (!job) throw notFound("Job");
  return { id: job.id, code: job.code, status: job.status, lockedAt: job.lockedAt };
}

export type NewRelease = {
  shopId: number;
  jobId: number;
  inspectorId: number;
  signedName: string;
  signedAt: Date;
  /** What the release keeps beside its hash: the checks, the gauges as they stood, item digests. */
  checklist: object;
  hash: string;
  canonicalVersion: number;
};

export async function insertRelease(t: Transaction, r: NewRelease): Promise<ReleaseRow> {
  const { Release } = models();
  const row = await Release.create({ ...r, checklist: r.checklist as JsonValue }, { transaction: t });
  return row.get({ plain: true }) as ReleaseRow;
}

export async function setJobReleased(t: Transaction, jobId: number, at: Date): Promise<void> {
  const { Job } = models();
  await Job.update({ status: "released", lockedAt: at }, { where: { id: jobId }, transaction: t });
}

export async function setJobReopened(t: Transaction, jobId: number): Promise<void> {
  const { Job } = models();
  await Job.update({ status: "review", lockedAt: null }, { where: { id: jobId }, transaction: t });
}

export async function voidRelease(t: Transaction, id: number, userId: number, reason: string, at: Date): Promise<void> {
  const { Release } = models();
  await Release.update(
    { voidedAt: at, voidedBy: userId, voidReason: reason },
    { where: { id, voidedAt: null }, transaction: t },
  );
}
