import "server-only";
import { bearingPoints } from "@/lib/domain";
import type { HousingsInput } from "@/lib/schemas/bearings";
import type { Actor } from "@/lib/schemas/session";
import { getSequelize } from "@/lib/server/core/db";
import { AppError } from "@/lib/server/core/errors";
import { assertJobEditable } from "@/lib/server/jobs/editable";
import { toEngineShape } from "@/lib/server/jobs/context";
import { getEngineOrThrow, lockJobOrThrow } from "@/lib/server/jobs/repo";
import { recordAudit } from "@/lib/server/log/repo";
import { findInstruments } from "@/lib/server/readings/gauge-repo";
import { listPoints, savePoint } from "@/lib/server/bearings/repo";

// Each point's housing bore, measured without shells with the caps torqued, square to the parting
// line (common practice), the gauge it was read with (its U goes into the prediction), which main
// takes the thrust shells, and any factory codes stamped for a grade table.

const invalid = (fields: Record<string, string[]>) => new AppError("invalid", "Some fields need fixing", fields);

export async function saveHousings(actor: Actor, jobId: number, input: HousingsInput): Promise<void> {
  await getSequelize().transaction(async (t) => {
    const job = await lockJobOrThrow(t, actor.shopId, jobId);
    assertJobEditable(job);
    const engine = await getEngineOrThrow(job.engineId);
    const known = new Set(bearingPoints(toEngineShape(engine, job)).map((p) => p.point));
    const fields: Record<string, string[]> = {};
    input.points.forEach((p, i) => {
      if (!known.has(p.point)) fields[`points.${i}.point`] = [`This engine has no ${p.point}`];
      if (p.thrust && !p.point.startsWith("main/")) fields[`points.${i}.thrust`] = ["Only a main takes thrust shells"];
    });
    if (input.points.filter((p) => p.thrust).length > 1) fields.thrust = ["Mark one main as the thrust main"];
    const gaugeIds = input.points.flatMap((p) => (p.housingGaugeId ? [p.housingGaugeId] : []));
    const gauges = await findInstruments(t, actor.shopId, gaugeIds);
    input.points.forEach((p, i) => {
      if (p.housingGaugeId && !gauges.has(p.housingGaugeId)) fields[`points.${i}.housingGaugeId`] = ["Pick a gauge"];
    });
    if (Object.keys(fields).length) throw invalid(fields);
    const before = await listPoints(actor.shopId, jobId, t);
    for (const p of input.points) {
      await savePoint(t, actor.shopId, jobId, p.point, {
        housingBore: p.housingBore,
        housingGaugeId: p.housingGaugeId,
        thrust: p.thrust,
        housingCode: p.housingCode ?? null,
        journalCode: p.journalCode ?? null,
      });
    }
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "bearings.housings",
      entityType: "job",
      entityId: jobId,
      before: before.map(({ point, housingBore, housingGaugeId, thrust }) => ({
        point,
        housingBore,
        housingGaugeId,
        thrust,
      })),
      after: input.points,
    });
  });
}
