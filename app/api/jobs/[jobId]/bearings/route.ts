import { authed, parseId } from "@/lib/server/core/route";
import { getBearingsView } from "@/lib/server/bearings/view";

type P = { jobId: string };

/** The job's shells, bearing points (housing bores, saved choice, measured clearance) and gauges. */
export const GET = authed<P>(["lead", "admin", "inspector"], async ({ actor, params }) =>
  getBearingsView(actor.shopId, parseId(params.jobId, "Job")),
);
