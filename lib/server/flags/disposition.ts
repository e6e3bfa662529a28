import "server-only";
import { isJobLocked, lockedJobWords, stationWords } from "@/lib/domain";
import type { Transaction } from "sequelize";
import { DISPOSITION_WORDS, type DispositionInput, type FlagListItem } from "@/lib/schemas/flag";
import type { Actor } from "@/lib/schemas/session";
import { recordAudit } from "@/lib/server/log/repo";
import { recordChange } from "@/lib/server/sync/repo";
import { AppError, notFound } from "@/lib/server/core/errors";
import { toListItem } from "@/lib/server/flags/list";
import { decisionTarget, getFlagOrThrow, recordDecision, type StoredFlag } from "@/lib/server/flags/repo";
import type { JobRow } from "@/lib/server/jobs/repo";
import { lockJobs } from "@/lib/server/readings/repo";
import { retriedTransaction } from "@/lib/server/core/cluster";

// The lead's decision on a flag: measure again, machine again (with the operation) or accept
// (with a written reason). Each decision appends a FlagDisposition row (the history) and sets the
// flag's latest decision; the tablet sees it through the change feed, and a measure/machine-again
// puts the station back on the route until a newer reading closes the flag (reconcile/reconcile.ts).

const when = (d: Date) => d.toISOString().slice(0, 16).replace("T", " ") + " UTC";

function refuseLocked(job: JobRow): void {
  const words = lockedJobWords({ ...job, locked: isJobLocked(job) }, "the decisions on its flags");
  if (words) throw new AppError("job_locked", words);
}

function refuseClosed(flag: StoredFlag): void {
  if (flag.state !== "closed") return;
  const at = flag.closedAt ? ` on ${when(flag.closedAt)}` : "";
  const by = flag.closedByReadingId ? " by a newer reading at the station" : " after the limits changed";
  throw new AppError(
    "conflict",
    `This flag was closed${at}${by}; there is nothing left to decide. Its history stays on record; ` +
      "a new flag opens if the value needs attention again.",
  );
}

/** Where the decision's words go: the operation, and the reason or note. */
function fieldsOf(input: DispositionInput): { operation: string | null; reason: string | null } {
  if (input.kind === "accept") return { operation: null, reason: input.reason };
  if (input.kind === "machine_again") return { operation: input.operation, reason: input.note ?? null };
  return { operation: null, reason: input.note ?? null };
}

const auditView = (f: StoredFlag) => ({
  state: f.state,
  disposition: f.disposition,
  operation: f.operation,
  dispositionReason: f.dispositionReason,
  disposedBy: f.disposedBy,
  disposedAt: f.disposedAt,
  verdict: f.verdict,
  reason: f.reason,
});

async function decide(t: Transaction, actor: Actor, flagId: number, jobId: number, input: DispositionInput) {
  // Same lock order as reconciliation (job row, then its flags), so the two never deadlock and a
  // reading arriving now either closes the flag before this decision or after it, never during.
  await lockJobs(t, actor.shopId, [jobId]);
  const target = await decisionTarget(t, actor.shopId, jobId, flagId);
  if (!target) throw notFound("Flag");
  const { job, flag } = target;
  refuseLocked(job);
  refuseClosed(flag);
  const before = auditView(flag);
  const { operation, reason } = fieldsOf(input);
  const decided = await recordDecision(t, flag, {
    disposition: input.kind,
    operation,
    reason,
    userId: actor.userId,
  });
  await recordAudit(t, {
    shopId: actor.shopId,
    userId: actor.userId,
    action: `flag.${input.kind}`,
    entityType: "flag",
    entityId: flag.id,
    before,
    after: {
      ...auditView(decided.flag),
      dispositionId: decided.dispositionId,
      station: stationWords(flag.stationId),
      words: DISPOSITION_WORDS[input.kind],
    },
  });
  await recordChange(t, { shopId: actor.shopId, jobId, entity: "flag", entityId: flag.id });
  return decided.dispositionId;
}

export async function disposeFlag(
  actor: Actor,
  flagId: number,
  input: DispositionInput,
): Promise<{ flag: FlagListItem; dispositionId: number }> {
  const found = await getFlagOrThrow(actor.shopId, flagId);
  const dispositionId = await retriedTransaction((t) => decide(t, actor, flagId, found.jobId, input));
  return { flag: toListItem(await getFlagOrThrow(actor.shopId, flagId)), dispositionId };
}
