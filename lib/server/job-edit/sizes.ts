import "server-only";
import type { Transaction } from "sequelize";
import { JOB_SIZES, type JobSize } from "@/lib/domain";
import type { JobEditValues, JobValues } from "@/lib/schemas/job";
import type { FinishedSizes } from "@/lib/schemas/job-sizes";
import type { Actor } from "@/lib/schemas/session";
import { recordAudit } from "@/lib/server/log/repo";
import { reconcileJob, type ReconcileResult } from "@/lib/server/reconcile/reconcile";

// A job's finished sizes (and the engine's design sizes they fall back to) are what job-size
// limits, ISO 286 classes and per-inch rules resolve from, so changing one re-judges the job's
// readings and flags exactly as a limits edit does, with its own audit event.

type SizeColumns = {
  finishedBore: number | null;
  finishedMainJournal: number | null;
  finishedRodJournal: number | null;
};
type EngineSizes = { nominalBore: number; nominalMainJournal?: number | null; nominalRodJournal?: number | null };
const COLUMN: Record<JobSize, keyof SizeColumns> = {
  bore: "finishedBore",
  mainJournal: "finishedMainJournal",
  rodJournal: "finishedRodJournal",
};

/**
 * The size columns a create or edit writes. On create a size left out is the engine's (standard
 * size unless the lead says otherwise); on edit, sizes left out of the request stay as stored.
 */
export function sizeColumns(v: JobValues | JobEditValues, engine: EngineSizes, stored?: SizeColumns): SizeColumns {
  const given = v.finishedSizes;
  if (!given && stored) {
    const { finishedBore, finishedMainJournal, finishedRodJournal } = stored;
    return { finishedBore, finishedMainJournal, finishedRodJournal };
  }
  const fallback: FinishedSizes = stored
    ? { bore: stored.finishedBore, mainJournal: stored.finishedMainJournal, rodJournal: stored.finishedRodJournal }
    : {
        bore: engine.nominalBore,
        mainJournal: engine.nominalMainJournal ?? null,
        rodJournal: engine.nominalRodJournal ?? null,
      };
  const out = {} as SizeColumns;
  for (const size of JOB_SIZES) {
    const value = given?.[size];
    out[COLUMN[size]] = value === undefined ? fallback[size] : value;
  }
  return out;
}

/** What limits can resolve from: the job's finished sizes and the engine's design sizes. */
export function sizesOf(job: SizeColumns, engine: EngineSizes) {
  return {
    finishedBore: job.finishedBore ?? null,
    finishedMainJournal: job.finishedMainJournal ?? null,
    finishedRodJournal: job.finishedRodJournal ?? null,
    nominalBore: engine.nominalBore,
    nominalMainJournal: engine.nominalMainJournal ?? null,
    nominalRodJournal: engine.nominalRodJournal ?? null,
  };
}
export type LimitSizes = ReturnType<typeof sizesOf>;

const same = (a: LimitSizes, b: LimitSizes) =>
  (Object.keys(a) as (keyof LimitSizes)[]).every((k) => Number(a[k] ?? 0) === Number(b[k] ?? 0));

/**
 * After the job and engine rows were updated in `t`: when a size the limits follow changed,
 * re-judge every current reading and make the flags match, and write one audit event saying so.
 */
export async function rejudgeOnSizeChange(
  t: Transaction,
  actor: Actor,
  jobId: number,
  before: LimitSizes,
  after: LimitSizes,
): Promise<ReconcileResult | null> {
  if (same(before, after)) return null;
  const r = await reconcileJob(t, { shopId: actor.shopId, jobId, userId: actor.userId, cause: "sizes_changed" });
  const result = { reevaluated: r.reevaluated.length, opened: r.opened.length, closed: r.closed.length };
  await recordAudit(t, {
    shopId: actor.shopId,
    userId: actor.userId,
    action: "job_sizes.update",
    entityType: "job",
    entityId: jobId,
    before,
    after: { ...after, reevaluated: result.reevaluated, flagsOpened: r.opened, flagsClosed: r.closed },
  });
  return r;
}
