import "server-only";
import { isJobLocked } from "@/lib/domain";
import type { JobLimitsView, LimitsSaved } from "@/lib/schemas/job";
import { compactLimit, type JobLimitsValues, type LimitValues } from "@/lib/schemas/spec";
import type { Actor } from "@/lib/schemas/session";
import { recordAudit } from "@/lib/server/log/repo";
import { recordChange } from "@/lib/server/sync/repo";
import { getSequelize } from "@/lib/server/core/db";
import { AppError } from "@/lib/server/core/errors";
import { reconcileJob } from "@/lib/server/reconcile/reconcile";
import { assertJobEditable } from "@/lib/server/jobs/editable";
import { loadJobContext, lockJobOrThrow, replaceJobLimitRows } from "@/lib/server/jobs/repo";
import { limitRow } from "@/lib/server/specs/repo";

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
    },
    limits: spec.map((l) => compactLimit(l as LimitValues)),
  };
}

export async function replaceJobLimits(actor: Actor, jobId: number, v: JobLimitsValues): Promise<LimitsSaved> {
  const result = await getSequelize().transaction(async (t) => {
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
    const before = (await loadJobContext(actor.shopId, jobId, t)).spec.map((l) => compactLimit(l as LimitValues));
    const from = job.specRevision;
    const revision = from + 1;
    await replaceJobLimitRows(t, jobId, v.limits.map(limitRow), revision);
    const r = await reconcileJob(t, { shopId: actor.shopId, jobId, userId: actor.userId, cause: "limits_changed" });
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
    return {
      reevaluated: r.reevaluated.length,
      opened: r.opened.length,
      closed: r.closed.length,
      updated: r.updatedFlags.length,
    };
  });
  return { ...(await getJobLimits(actor.shopId, jobId)), result };
}
