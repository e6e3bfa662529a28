import "server-only";
import type { StudySettings } from "@/lib/schemas/gauge-studies";
import type { Actor } from "@/lib/schemas/session";
import { getSequelize } from "@/lib/server/core/db";
import { recordAudit } from "@/lib/server/log/repo";
import { saveStudySettings } from "./repo";

/**
 * Stores the shop's study thresholds with an audit event. A kept study keeps the marks it was judged
 * by (its record says which), so changing them re-judges nothing: the next study of each gauge uses them.
 */
export async function updateStudySettings(actor: Actor, next: StudySettings): Promise<StudySettings> {
  return getSequelize().transaction(async (t) => {
    const { before, after } = await saveStudySettings(t, actor.shopId, next);
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "gauge.study.settings",
      entityType: "shop",
      entityId: actor.shopId,
      before,
      after,
    });
    return after;
  });
}
