import { getInstrument, updateInstrument } from "@/lib/server/gauges/repo";
import { authed, parseId, readJson } from "@/lib/server/core/route";
import { instrumentPatchSchema } from "@/lib/schemas/instrument";

type P = { instrumentId: string };

export const GET = authed<P>(["admin", "lead", "inspector"], async ({ actor, params }) => ({
  instrument: await getInstrument(actor.shopId, parseId(params.instrumentId, "Gauge")),
}));

/** Edit a gauge, or deactivate / reactivate it with { active } (admin). */
export const PATCH = authed<P>(["admin"], async ({ req, actor, params }) => {
  const id = parseId(params.instrumentId, "Gauge");
  const patch = await readJson(req, instrumentPatchSchema);
  return { instrument: await updateInstrument(actor, id, patch) };
});
