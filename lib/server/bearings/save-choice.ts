import "server-only";
import type { ChoiceInput, SelectionAnswer } from "@/lib/schemas/bearings";
import type { Actor } from "@/lib/schemas/session";
import { getSequelize } from "@/lib/server/core/db";
import { AppError } from "@/lib/server/core/errors";
import { assertJobEditable } from "@/lib/server/jobs/editable";
import { lockJobOrThrow } from "@/lib/server/jobs/repo";
import { recordAudit } from "@/lib/server/log/repo";
import { savePoint } from "@/lib/server/bearings/repo";
import { judgeChoice, loadSelection } from "@/lib/server/bearings/select";

// Saving the halves chosen for each point, with the clearance the core predicts for them. A choice
// the rules refuse is not saved (422 with the core's words); the audit event keeps what moved.

export async function saveChoice(actor: Actor, jobId: number, choice: ChoiceInput): Promise<SelectionAnswer> {
  return getSequelize().transaction(async (t) => {
    const job = await lockJobOrThrow(t, actor.shopId, jobId);
    assertJobEditable(job);
    const loaded = await loadSelection(actor.shopId, jobId);
    const answer = judgeChoice(loaded, choice);
    if (answer.problems.length) {
      throw new AppError("invalid", answer.problems.join("; "), { points: answer.problems });
    }
    for (const c of choice.points) {
      const p = answer.points.find((x) => x.point === c.point);
      await savePoint(t, actor.shopId, jobId, c.point, {
        upperShellId: p?.upperShellId ?? null,
        lowerShellId: p?.lowerShellId ?? null,
        predictedClearance: p?.predicted?.value ?? null,
        predictedU: p?.predicted?.uncertainty ?? null,
        byHand: c.byHand,
        chosenBy: actor.userId,
      });
    }
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "bearings.choice",
      entityType: "job",
      entityId: jobId,
      before: loaded.points.map(({ point, upperShellId, lowerShellId, predictedClearance }) => ({
        point,
        upperShellId,
        lowerShellId,
        predictedClearance,
      })),
      after: {
        points: answer.points,
        moved: answer.moved,
        byHand: choice.points.filter((c) => c.byHand).map((c) => c.point),
      },
    });
    return answer;
  });
}
