import "server-only";
import { isJobLocked } from "@/lib/domain";
import { buildPlanSchema, type BuildPlan } from "@/lib/schemas/build-plan";
import { Engine, Job } from "@/models";
import type { JsonObject } from "@/lib/schemas/json";
import type { Actor } from "@/lib/schemas/session";
import { recordAudit } from "@/lib/server/log/audit";
import { getSequelize } from "@/lib/server/core/db";
import { AppError, notFound } from "@/lib/server/core/errors";
import { assertJobEditable } from "@/lib/server/jobs/admin-repo";

// The build plan lives on jobs.build_plan as the schema's JSON (units written in).
export type BuildPlanView = {
  plan: BuildPlan | null;
  job: { id: number; code: string; title: string; unitSystem: "in" | "mm"; locked: boolean };
  engine: { cylinders: number; nominalBore: number; nominalStroke: number; description: string };
};

/** A stored plan read back through the schema, so an old or hand-edited value never reaches the page unchecked. */
function parseStored(raw: unknown): BuildPlan | null {
  if (!raw) return null;
  const parsed = buildPlanSchema.safeParse(raw);
  return parsed.success ? parsed.data : null;
}

export async function getBuildPlan(shopId: number, jobId: number): Promise<BuildPlanView> {
  getSequelize();
  const job = await Job.findOne({ where: { id: jobId, shopId } });
  if (!job) throw notFound("Job");
  const engine = await Engine.findByPk(job.engineId);
  if (!engine) throw notFound("Engine");
  return {
    plan: parseStored(job.buildPlan),
    job: { id: job.id, code: job.code, title: job.title, unitSystem: job.unitSystem, locked: isJobLocked(job) },
    engine: {
      cylinders: engine.cylinders,
      nominalBore: engine.nominalBore,
      nominalStroke: engine.nominalStroke,
      description: engine.description,
    },
  };
}

export async function saveBuildPlan(actor: Actor, jobId: number, plan: BuildPlan): Promise<void> {
  await getSequelize().transaction(async (t) => {
    const job = await Job.findOne({ where: { id: jobId, shopId: actor.shopId }, transaction: t, lock: t.LOCK.UPDATE });
    if (!job) throw notFound("Job");
    assertJobEditable(job);
    if (plan.lengthUnit !== job.unitSystem) {
      throw new AppError("invalid", "Some fields need fixing", {
        lengthUnit: [`This job is in ${job.unitSystem}; enter the plan in ${job.unitSystem}`],
      });
    }
    const before = job.buildPlan;
    await job.update({ buildPlan: plan as unknown as JsonObject }, { transaction: t });
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "job.build_plan",
      entityType: "job",
      entityId: jobId,
      before,
      after: plan,
    });
  });
}
