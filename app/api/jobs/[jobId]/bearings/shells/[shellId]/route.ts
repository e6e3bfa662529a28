import { shellInputSchema } from "@/lib/schemas/bearings";
import { authed, parseId, readJson } from "@/lib/server/core/route";
import { getJobOrThrow } from "@/lib/server/jobs/repo";
import { editShell, removeShell } from "@/lib/server/bearings/shells";
import { getBearingsView } from "@/lib/server/bearings/view";

type P = { jobId: string; shellId: string };

export const PUT = authed<P>(["lead"], async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  await getJobOrThrow(actor.shopId, jobId);
  const input = await readJson(req, shellInputSchema);
  await editShell(actor, jobId, parseId(params.shellId, "Shell set"), input);
  return getBearingsView(actor.shopId, jobId);
});

/** Take a set off the shelf list; refused while the saved choice uses it. */
export const DELETE = authed<P>(["lead"], async ({ actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  await removeShell(actor, jobId, parseId(params.shellId, "Shell set"));
  return getBearingsView(actor.shopId, jobId);
});
