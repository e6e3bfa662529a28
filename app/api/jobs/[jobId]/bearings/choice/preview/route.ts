import { choiceSchema } from "@/lib/schemas/bearings";
import { authed, parseId, readJson } from "@/lib/server/core/route";
import { getJobOrThrow } from "@/lib/server/jobs/repo";
import { previewChoice } from "@/lib/server/bearings/select";

type P = { jobId: string };

/** What a choice would predict and move against the saved one, before it is saved. */
export const POST = authed<P>(["lead"], async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  await getJobOrThrow(actor.shopId, jobId);
  return previewChoice(actor.shopId, jobId, await readJson(req, choiceSchema));
});
