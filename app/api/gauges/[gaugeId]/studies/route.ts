import { studyInput } from "@/lib/schemas/gauge-studies";
import { authed, parseId, readJson } from "@/lib/server/core/route";
import { listStudies } from "@/lib/server/gauge-studies/repo";
import { saveStudy } from "@/lib/server/gauge-studies/save";

type P = { gaugeId: string };

/** The gauge's studies, newest first, with their results. */
export const GET = authed<P>(["admin", "lead", "inspector", "machinist"], async ({ actor, params }) => ({
  studies: await listStudies(actor.shopId, parseId(params.gaugeId, "Gauge")),
}));

/**
 * Save a study: the server works out every figure with the core from the readings sent, keeps the
 * study and judges again the open jobs' readings taken with the gauge. 409 when that opens more
 * flags than a wide change may without `confirmedFlagsOpened`.
 */
export const POST = authed<P>(["admin", "lead", "machinist"], async ({ req, actor, params }) => {
  const gaugeId = parseId(params.gaugeId, "Gauge");
  const input = await readJson(req, studyInput);
  return Response.json(await saveStudy(actor, gaugeId, input), { status: 201 });
});
