import { studyInput } from "@/lib/schemas/gauge-studies";
import { authed, parseId, readJson } from "@/lib/server/core/route";
import { previewStudy } from "@/lib/server/gauge-studies/save";

type P = { gaugeId: string };

/**
 * The study's result and what saving it would do (verdicts changed and flags opened per open job
 * the gauge was used on): the very save runs and rolls back. Refuses what the save refuses.
 */
export const POST = authed<P>(["admin", "lead", "machinist"], async ({ req, actor, params }) => {
  const gaugeId = parseId(params.gaugeId, "Gauge");
  const input = await readJson(req, studyInput);
  return previewStudy(actor, gaugeId, input);
});
