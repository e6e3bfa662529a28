import { shellInputSchema } from "@/lib/schemas/bearings";
import { authed, parseId, readJson } from "@/lib/server/core/route";
import { getJobOrThrow } from "@/lib/server/jobs/repo";
import { addShell } from "@/lib/server/bearings/shells";
import { getBearingsView } from "@/lib/server/bearings/view";

type P = { jobId: string };

/** Put a set of shells on the job's shelf (figures in the job's unit). */
export const POST = authed<P>(["lead"], async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  await getJobOrThrow(actor.shopId, jobId); // another shop's job is 404 whatever the body
  const input = await readJson(req, shellInputSchema);
  await addShell(actor, jobId, input);
  return getBearingsView(actor.shopId, jobId);
});
