import { buildPlanSchema } from "@/lib/schemas/build-plan";
import { getBuildPlan, saveBuildPlan } from "@/lib/server/jobs/plan";
import { getJobOrThrow } from "@/lib/server/jobs/repo";
import { authed, parseId, readJson } from "@/lib/server/core/route";

type P = { jobId: string };

export const GET = authed<P>(["lead", "admin", "inspector"], async ({ actor, params }) =>
  getBuildPlan(actor.shopId, parseId(params.jobId, "Job")),
);

/** Save the whole plan (lengths in the job's unit, volumes in cc). */
export const PUT = authed<P>(["lead"], async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  await getJobOrThrow(actor.shopId, jobId); // another shop's job is 404 whatever the body
  const plan = await readJson(req, buildPlanSchema);
  await saveBuildPlan(actor, jobId, plan);
  return getBuildPlan(actor.shopId, jobId);
});
