import { jobEditSchema } from "@/lib/schemas/job";
import { getJobDetail } from "@/lib/server/jobs/detail";
import { updateJob } from "@/lib/server/job-edit/repo";
import { getJobOrThrow } from "@/lib/server/jobs/repo";
import { authed, parseId, readJson } from "@/lib/server/core/route";

type P = { jobId: string };

/** One job: header, engine, readings summary, flag counts. */
export const GET = authed<P>(["lead", "admin", "inspector"], async ({ actor, params }) =>
  getJobDetail(actor.shopId, parseId(params.jobId, "Job")),
);

/** Edit the job (not its limits; those have their own route). Refused once released. */
export const PATCH = authed<P>(["lead"], async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  await getJobOrThrow(actor.shopId, jobId); // another shop's job is 404 whatever the body
  const values = await readJson(req, jobEditSchema);
  await updateJob(actor, jobId, values);
  return getJobDetail(actor.shopId, jobId);
});
