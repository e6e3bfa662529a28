import { authed } from "@/lib/server/core/route";
import { guideState } from "@/lib/server/shops/guide";

/** The first-job guide's ticks, for the desk's jobs board (the caller's shop only). */
export const GET = authed(["lead", "admin"], async ({ actor }) => guideState(actor.shopId));
