import { authed } from "@/lib/server/core/route";
import { latestStudyLines } from "@/lib/server/gauge-studies/overview";

/** Each gauge's latest study (date, due date, passed), for the gauge list. */
export const GET = authed(["admin", "lead", "inspector"], async ({ actor }) => ({
  studies: await latestStudyLines(actor.shopId),
}));
