import "server-only";
import { isJobLocked, planFigureProblems } from "@/lib/domain";
import { buildPlanSchema, type BuildPlan, type BuildPlanView } from "@/lib/schemas/build-plan";
import type { JsonObject } from "@/lib/schemas/json";
import type { Actor } from "@/lib/schemas/session";
import { recordAudit } from "@/lib/server/log/repo";
import { getSequelize } from "@/lib/server/core/db";
import { AppError } from "@/lib/server/core/errors";
import { assertJobEditable } from "@/lib/server/jobs/editable";
import { toEngineShape } from "@/lib/server/jobs/context";
import { getEngineOrThrow, getJobOrThrow, lockJobOrThrow, saveJobBuildPlan } from "@/lib/server/jobs/repo";

// The build plan lives on jobs.build_plan as the schema's JSON (units written in).

/** A stored plan read back through the schema, so an old or hand-edited value never reaches the page unchecked. */
export function parseStoredPlan(raw: unknown): BuildPlan | null {
  if (!raw) return null;
  const parsed = buildPlanSchema.safeParse(raw);
  return parsed.success ? parsed.data : null;
}

export async function getBuildPlan(shopId: number, jobId: number): Promise<BuildPlanView> {
  const job = await getJobOrThrow(shopId, jobId);
  const engine = await getEngineOrThrow(job.engineId);
  return {
    plan: parseStoredPlan(job.buildPlan),
    job: {
      id: job.id,
      code: job.code,
      title: job.title,
      status: job.status,
      unitSystem: job.unitSystem,
      locked: isJobLocked(job),
      finishedBore: job.finishedBore ?? null,
    },
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
    const job = await lockJobOrThrow(t, actor.shopId, jobId);
    assertJobEditable(job);
    if (plan.lengthUnit !== job.unitSystem) {
      throw new AppError("invalid", "Some fields need fixing", {
        lengthUnit: [`This job is in ${job.unitSystem}; enter the plan in ${job.unitSystem}`],
      });
    }
    // The schema checked each size alone; the bore is also checked against this engine's own.
    const engine = await getEngineOrThrow(job.engineId);
    const problems = planFigureProblems(plan, toEngineShape(engine, job));
    if (problems.length) {
      const fields = Object.fromEntries(problems.map((p) => [p.field, [p.message]]));
      throw new AppError("invalid", "Some fields need fixing", fields);
    }
    await saveJobBuildPlan(t, jobId, plan as unknown as JsonObject);
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "job.build_plan",
      entityType: "job",
      entityId: jobId,
      before: job.buildPlan,
      after: plan,
    });
  });
}
