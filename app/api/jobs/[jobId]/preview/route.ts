import { jobEditSchema } from "@/lib/schemas/job";
import { previewJobEdit } from "@/lib/server/job-edit/repo";
import { getJobOrThrow } from "@/lib/server/jobs/repo";
import { authed, parseId, readJson } from "@/lib/server/core/route";

type P = { jobId: string };

/**
 * What saving this edit would do: a changed finished size re-judges the job's readings, so the
 * very edit runs and rolls back and the flags it opens and closes are counted. Refuses what the
 * edit refuses, the same way.
 */
export const POST = authed<P>(["lead"], async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  await getJobOrThrow(actor.shopId, jobId); // another shop's job is 404 whatever the body
  const values = await readJson(req, jobEditSchema);
  return previewJobEdit(actor, jobId, values);
});
