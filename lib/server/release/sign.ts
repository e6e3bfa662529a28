import "server-only";
import { isJobLocked, lockWayOut, reopenRefusal } from "@/lib/domain";
import type { ReleaseRecord, ReopenInput, SignInput } from "@/lib/schemas/release";
import type { Actor } from "@/lib/schemas/session";
import { recordAudit } from "@/lib/server/log/repo";
import { recordChange } from "@/lib/server/sync/repo";
import { retriedTransaction } from "@/lib/server/core/cluster";
import { AppError } from "@/lib/server/core/errors";
import { getJobOrThrow } from "@/lib/server/jobs/repo";
import { enqueueReleaseMail } from "@/lib/server/mail/outbox";
import { enqueueVoidMail } from "@/lib/server/mail/void-mail";
import { checklistOf } from "@/lib/server/release/checklist";
import { CANONICAL_VERSION, itemDigests, releaseHash } from "@/lib/server/release/hash";
import { buildSnapshot, gaugeRecord } from "@/lib/server/release/hash-snapshot";
import {
  activeRelease,
  insertRelease,
  loadJobRecord,
  lockJob,
  setJobReleased,
  setJobReopened,
  userNames,
  voidRelease,
  type ReleaseRow,
} from "@/lib/server/release/repo";
import { checkSigner } from "@/lib/server/release/signer";
import { storeAfterSigning } from "@/lib/server/record/stored";

// The inspector's e-signature (typed full name + password again) and the lead's reopen. Both run
// in one transaction with the job row locked, and both are audited and fed to the tablets; the
// signature queues the customer's build-record mail in that transaction, the reopen the notice
// that the record they were sent is void.

export function toReleaseRecord(r: ReleaseRow, names: Map<number, string>): ReleaseRecord {
  return {
    id: r.id,
    jobId: r.jobId,
    status: r.voidedAt ? "void" : "standing",
    inspectorName: names.get(r.inspectorId) ?? r.signedName,
    signedAt: r.signedAt.toISOString(),
    hash: r.hash,
    canonicalVersion: r.canonicalVersion,
    voidedAt: r.voidedAt ? r.voidedAt.toISOString() : null,
    voidedByName: r.voidedBy ? (names.get(r.voidedBy) ?? null) : null,
    voidReason: r.voidReason ?? null,
  };
}

/** Signs the release of a job whose checklist is empty, stores its hash, and locks the job. */
export async function signRelease(actor: Actor, jobId: number, input: SignInput): Promise<ReleaseRecord> {
  await getJobOrThrow(actor.shopId, jobId); // 404 for another shop's job before anything else
  const signedName = await checkSigner(actor, input);
  const row = await retriedTransaction(async (t) => {
    const record = await loadJobRecord(actor.shopId, jobId, t, true);
    const { job } = record;
    if (isJobLocked(job) || (await activeRelease(jobId, t))) {
      throw new AppError(
        "conflict",
        `Job ${job.code} is already ${job.status === "closed" ? "closed" : "released"}. ` +
          lockWayOut(job.status === "closed" ? "closed" : "released"),
      );
    }
    const checklist = checklistOf(record);
    if (!checklist.complete) {
      throw new AppError(
        "conflict",
        `Job ${job.code} cannot be released yet: ${checklist.unmet.length} item(s) on the checklist still block it`,
        {
          checklist: checklist.unmet.slice(0, 50).map((i) => i.text),
        },
      );
    }
    const signedAt = new Date();
    const gauges = record.instruments.map(gaugeRecord);
    const snapshot = buildSnapshot(record, { inspectorId: actor.userId, signedName, signedAt }, gauges);
    const hash = releaseHash(snapshot);
    const stored = {
      version: CANONICAL_VERSION,
      checks: checklist.checks.map((c) => ({ id: c.id, title: c.title, summary: c.summary })),
      gauges,
      digests: itemDigests(snapshot),
    };
    const release = await insertRelease(t, {
      shopId: actor.shopId,
      jobId,
      inspectorId: actor.userId,
      signedName,
      signedAt,
      checklist: stored,
      hash,
      canonicalVersion: CANONICAL_VERSION,
    });
    await setJobReleased(t, jobId, signedAt);
    // The customer's build record is queued here, so it stands or falls with the release.
    await enqueueReleaseMail(t, { shopId: actor.shopId, jobId, releaseId: release.id });
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "release.sign",
      entityType: "release",
      entityId: release.id,
      before: { jobId, jobStatus: job.status, lockedAt: null },
      after: {
        jobId,
        jobCode: job.code,
        jobStatus: "released",
        lockedAt: signedAt.toISOString(),
        // What the inspector typed as the e-signature; screens and records print the account's name.
        typedSignature: signedName,
        signedAt: signedAt.toISOString(),
        hash,
      },
    });
    await recordChange(t, { shopId: actor.shopId, jobId, entity: "job", entityId: jobId });
    return release;
  });
  // After the commit, so the signature never waits on (or is lost with) object storage.
  await storeAfterSigning(actor.shopId, jobId, row.id);
  return toReleaseRecord(row, await userNames(actor.shopId, [row.inspectorId]));
}

/** The lead reopens a released job: the release is voided (kept, marked VOID) and the job unlocked. */
export async function reopenRelease(actor: Actor, jobId: number, input: ReopenInput): Promise<ReleaseRecord> {
  const row = await retriedTransaction(async (t) => {
    const job = await lockJob(t, actor.shopId, jobId);
    const release = await activeRelease(jobId, t);
    const refusal = reopenRefusal(actor.role, { ...job, hasStandingRelease: !!release });
    if (refusal || !release) throw new AppError(refusal?.code ?? "conflict", refusal?.message ?? "No release");
    const voidedAt = new Date();
    await voidRelease(t, release.id, actor.userId, input.reason, voidedAt);
    await setJobReopened(t, jobId);
    const signer = (await userNames(actor.shopId, [release.inspectorId], t)).get(release.inspectorId);
    const mailed = await enqueueVoidMail(t, {
      shopId: actor.shopId,
      jobId,
      releaseId: release.id,
      hash: release.hash,
      signedAt: release.signedAt,
      signerName: signer ?? release.signedName,
      reason: input.reason,
      voidedAt,
    });
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "release.void",
      entityType: "release",
      entityId: release.id,
      before: {
        jobId,
        jobStatus: job.status,
        lockedAt: job.lockedAt?.toISOString() ?? null,
        releaseStatus: "standing",
      },
      after: {
        jobId,
        jobCode: job.code,
        jobStatus: "review",
        lockedAt: null,
        releaseStatus: "void",
        voidReason: input.reason,
        voidedAt: voidedAt.toISOString(),
        customerNotified: mailed > 0,
      },
    });
    await recordChange(t, { shopId: actor.shopId, jobId, entity: "job", entityId: jobId });
    return { ...release, voidedAt, voidedBy: actor.userId, voidReason: input.reason };
  });
  return toReleaseRecord(row, await userNames(actor.shopId, [row.inspectorId, row.voidedBy]));
}
