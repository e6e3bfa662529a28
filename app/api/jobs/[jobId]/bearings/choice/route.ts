import { choiceSchema } from "@/lib/schemas/bearings";
import { authed, parseId, readJson } from "@/lib/server/core/route";
import { getJobOrThrow } from "@/lib/server/jobs/repo";
import { saveChoice } from "@/lib/server/bearings/save-choice";

type P = { jobId: string };

/** Save the halves of each point; refused (422, with the rules' words) when the rules refuse them. */
export const PUT = authed<P>(["lead"], async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  await getJobOrThrow(actor.shopId, jobId);
  return saveChoice(actor, jobId, await readJson(req, choiceSchema));
});
