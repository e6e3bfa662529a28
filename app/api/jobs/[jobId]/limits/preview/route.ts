import { jobLimitsSchema } from "@/lib/schemas/spec";
import { getJobOrThrow } from "@/lib/server/jobs/repo";
import { previewJobLimits } from "@/lib/server/jobs/reevaluate";
import { authed, parseId, readJson } from "@/lib/server/core/route";

type P = { jobId: string };

/**
 * What saving these limits would do (flags opened and closed, verdicts changed, required stations
 * affected): the very save runs and rolls back, so the counts are the save's own. Refuses what the
 * save refuses, the same way.
 */
export const POST = authed<P>(["lead"], async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  await getJobOrThrow(actor.shopId, jobId); // another shop's job is 404 whatever the body
  const values = await readJson(req, jobLimitsSchema);
  return previewJobLimits(actor, jobId, values);
});
