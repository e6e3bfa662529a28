import { getFlagDetail } from "@/lib/server/flags/detail";
import { authed, parseId } from "@/lib/server/core/route";

/** One flag: station history with corrections and photos, derived values it feeds, decisions. */
export const GET = authed<{ flagId: string }>(["lead", "inspector"], async ({ actor, params }) =>
  getFlagDetail(actor.shopId, parseId(params.flagId, "Flag")),
);
