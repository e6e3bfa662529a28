import { housingsSchema } from "@/lib/schemas/bearings";
import { authed, parseId, readJson } from "@/lib/server/core/route";
import { getJobOrThrow } from "@/lib/server/jobs/repo";
import { saveHousings } from "@/lib/server/bearings/housings";
import { getBearingsView } from "@/lib/server/bearings/view";

type P = { jobId: string };

/** Housing bores (without shells), their gauges, the thrust main and any stamped codes. */
export const PUT = authed<P>(["lead"], async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  await getJobOrThrow(actor.shopId, jobId);
  await saveHousings(actor, jobId, await readJson(req, housingsSchema));
  return getBearingsView(actor.shopId, jobId);
});
