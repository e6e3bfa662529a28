import { authed, parseId } from "@/lib/server/core/route";
import { runSelection } from "@/lib/server/bearings/select";

type P = { jobId: string };

/** The core's pick of halves for every measured point; nothing is saved. */
export const POST = authed<P>(["lead"], async ({ actor, params }) =>
  runSelection(actor.shopId, parseId(params.jobId, "Job")),
);
