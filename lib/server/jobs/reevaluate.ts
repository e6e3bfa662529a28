import "server-only";
import type { Transaction } from "sequelize";
import { isJobLocked, limitEngineProblems, type Consequences } from "@/lib/domain";
import type { JobLimitsView, LimitsPreview, LimitsSaved } from "@/lib/schemas/job";
import { compactLimit, type JobLimitsValues, type LimitValues } from "@/lib/schemas/spec";
import { commonPracticeMarks } from "@/lib/schemas/common-practice";
import type { Actor } from "@/lib/schemas/session";
import { recordAudit } from "@/lib/server/log/repo";
import { recordChange } from "@/lib/server/sync/repo";
import { AppError } from "@/lib/server/core/errors";
import { reconcileJob } from "@/lib/server/reconcile/reconcile";
import { assertJobEditable } from "@/lib/server/jobs/editable";
import type { JobContext } from "@/lib/server/jobs/context";
import { assertConfirmed, countConsequences, previewChange } from "@/lib/server/jobs/consequences";
import { loadJobContext, lockJobOrThrow, replaceJobLimitRows } from "@/lib/server/jobs/repo";
import { limitRow } from "@/lib/server/specs/repo";
import { retriedTransaction } from "@/lib/server/core/cluster";

// A job's own limit snapshot: read it, or replace it and re-evaluate the job's readings and
// flags against the new limits, all in one transaction (reconcile/reconcile.ts does the judging).
export async function getJobLimits(shopId: number, jobId: number): Promise<JobLimitsView> {
  const { job, spec } = await loadJobContext(shopId, jobId);
  return {
    job: {
      id: job.id,
      code: job.code,
      title: job.title,
      unitSystem: job.unitSystem,
      status: job.status,
      locked: isJobLocked(job),
      specRevision: job.specRevision,
      finishedSizes: {
        bore: job.finishedBore ?? null,
        mainJournal: job.finishedMainJournal ?? null,
        rodJournal: job.finishedRodJournal ?? null,
      },
    },
    limits: spec.map((l) => compactLimit(l as LimitValues)),
  };
}

type Applied = { result: LimitsSaved["result"]; consequences: Consequences };

/** Bore and skirt limits near the engine's nominal bore, as readings are (422 on the field). */
function assertNearEngine(ctx: JobContext, v: JobLimitsValues) {
  const fields: Record<string, string[]> = {};
  v.limits.forEach((l, i) => {
    for (const p of limitEngineProblems(l, ctx.shape)) (fields[`limits.${i}.${p.field}`] ??= []).push(p.message);
  });
  if (Object.keys(fields).length) throw new AppError("invalid", "Some limits need fixing", fields);
}

/** The save itself, inside the caller's transaction: swap the limits, re-judge, audit; counts what it did. */
async function applyLimits(t: Transaction, actor: Actor, jobId: number, v: JobLimitsValues): Promise<Applied> {
  const job = await lockJobOrThrow(t, actor.shopId, jobId);
  assertJobEditable(job);
  if (v.specRevision !== job.specRevision) {
    throw new AppError(
      "conflict",
      `Someone changed these limits since you opened them (now revision ${job.specRevision}); ` +
        "reload the page, then make your change again",
      { specRevision: [`Now ${job.specRevision}`] },
    );
  }
  const ctxBefore = await loadJobContext(actor.shopId, jobId, t);
  assertNearEngine(ctxBefore, v);
  const before = ctxBefore.spec.map((l) => compactLimit(l as LimitValues));
  const from = job.specRevision;
  const revision = from + 1;
  const marks = commonPracticeMarks(v.limits, before);
  await replaceJobLimitRows(
    t,
    jobId,
    v.limits.map((l, i) => limitRow(l, i, marks[i])),
    revision,
  );
  const r = await reconcileJob(t, { shopId: actor.shopId, jobId, userId: actor.userId, cause: "limits_changed" });
  const consequences = await countConsequences(t, ctxBefore, r);
  const after = (await loadJobContext(actor.shopId, jobId, t)).spec.map((l) => compactLimit(l as LimitValues));
  await recordAudit(t, {
    shopId: actor.shopId,
    userId: actor.userId,
    action: "job_limits.update",
    entityType: "job",
    entityId: jobId,
    before: { specRevision: from, limits: before },
    after: {
      specRevision: revision,
      limits: after,
      reevaluated: r.reevaluated.length,
      flagsOpened: r.opened,
      flagsClosed: r.closed,
    },
  });
  await recordChange(t, { shopId: actor.shopId, jobId, entity: "job_limits", entityId: jobId });
  const result = {
    reevaluated: r.reevaluated.length,
    opened: r.opened.length,
    closed: r.closed.length,
    updated: r.updatedFlags.length,
  };
  return { result, consequences };
}

/** What saving these limits would do, counted by the very same save, rolled back. */
export function previewJobLimits(actor: Actor, jobId: number, v: JobLimitsValues): Promise<LimitsPreview> {
  return previewChange(async (t) => (await applyLimits(t, actor, jobId, v)).consequences);
}

export async function replaceJobLimits(actor: Actor, jobId: number, v: JobLimitsValues): Promise<LimitsSaved> {
  const applied = await retriedTransaction(async (t) => {
    const a = await applyLimits(t, actor, jobId, v);
    assertConfirmed(a.consequences, v.confirmedFlagsOpened);
    return a;
  });
  return { ...(await getJobLimits(actor.shopId, jobId)), ...applied };
}
