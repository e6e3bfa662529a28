import { recordAudit } from "@/lib/server/log/repo";
import { getSequelize } from "@/lib/server/core/db";
import { AppError } from "@/lib/server/core/errors";
import { getJobOrThrow } from "@/lib/server/jobs/repo";
import { enqueueRecordResend } from "@/lib/server/mail/outbox";
import { activeRelease } from "@/lib/server/release/repo";
import { authed, parseId } from "@/lib/server/core/route";

// Sends the standing release's build record to the customer again, with a fresh link (for a
// customer whose link expired or whose mail went astray). Queued; the notifier delivers it.
export const POST = authed<{ jobId: string }>(["lead", "inspector", "admin"], async ({ actor, params }) => {
  const job = await getJobOrThrow(actor.shopId, parseId(params.jobId, "Job"));
  const release = await activeRelease(job.id);
  if (!release)
    throw new AppError(
      "conflict",
      `Job ${job.code} has no standing release, so there is no record to send; release it first`,
    );
  const queued = await getSequelize().transaction(async (t) => {
    const ok = await enqueueRecordResend(t, { shopId: actor.shopId, jobId: job.id, releaseId: release.id });
    if (ok)
      await recordAudit(t, {
        shopId: actor.shopId,
        userId: actor.userId,
        action: "record.send",
        entityType: "release",
        entityId: release.id,
        after: { jobId: job.id, jobCode: job.code },
      });
    return ok;
  });
  if (!queued)
    throw new AppError(
      "conflict",
      `The customer of job ${job.code} has no e-mail address; add one to the customer first`,
    );
  return Response.json({ queued: true }, { status: 202 });
});
