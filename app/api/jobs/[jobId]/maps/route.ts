import { jobMaps } from "@/lib/server/readings/maps";
import { authed, parseId } from "@/lib/server/core/route";

/** Bore, journal and deck maps of a job (lead, inspector): current figures with limits and verdicts. */
export const GET = authed<{ jobId: string }>(["lead", "inspector"], async ({ actor, params }) =>
  jobMaps(actor.shopId, parseId(params.jobId, "Job")),
);
