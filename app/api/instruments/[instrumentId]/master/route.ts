import { setSettingMaster } from "@/lib/server/gauges/repo";
import { authed, parseId, readJson } from "@/lib/server/core/route";
import { settingMasterSchema } from "@/lib/schemas/setting-master";

type P = { instrumentId: string };

/** Set or change the gauge's setting master (admin): { label, size, expandedU } in the gauge's unit. */
export const PUT = authed<P>(["admin"], async ({ req, actor, params }) => {
  const id = parseId(params.instrumentId, "Gauge");
  const master = await readJson(req, settingMasterSchema);
  return { instrument: await setSettingMaster(actor, id, master) };
});

/** Remove the gauge's setting master (admin); a study then takes its reference as typed on the tablet. */
export const DELETE = authed<P>(["admin"], async ({ actor, params }) => ({
  instrument: await setSettingMaster(actor, parseId(params.instrumentId, "Gauge"), null),
}));
