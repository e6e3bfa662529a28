import { jobLimitsSchema } from "@/lib/schemas/spec";
import { getJobOrThrow } from "@/lib/server/jobs/repo";
import { getJobLimits, replaceJobLimits } from "@/lib/server/jobs/reevaluate";
import { authed, parseId, readJson } from "@/lib/server/core/route";

type P = { jobId: string };

/** The job's own limits (its snapshot of the template, as edited since). */
export const GET = authed<P>(["lead", "admin", "inspector"], async ({ actor, params }) =>
  getJobLimits(actor.shopId, parseId(params.jobId, "Job")),
);

/**
 * Replace the job's limits: one transaction swaps them, bumps specRevision, re-evaluates every
 * current reading and derived value (opening and closing flags), and audits before and after.
 * 409 when the job is locked or the limits changed since `specRevision`.
 */
export const PUT = authed<P>(["lead"], async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  await getJobOrThrow(actor.shopId, jobId); // another shop's job is 404 whatever the body
  const values = await readJson(req, jobLimitsSchema);
  return replaceJobLimits(actor, jobId, values);
});
