import { invalid } from "@/lib/server/core/errors";
import { createInstrument, listInstruments } from "@/lib/server/gauges/repo";
import { authed, readJson } from "@/lib/server/core/route";
import { instrumentListQuery, instrumentSchema } from "@/lib/schemas/instrument";

/** The shop's gauges with calibration status (admin manages; lead and inspector read). ?include=all adds deactivated ones. */
export const GET = authed(["admin", "lead", "inspector"], async ({ req, actor }) => {
  const parsed = instrumentListQuery.safeParse({ include: new URL(req.url).searchParams.get("include") ?? undefined });
  if (!parsed.success) throw invalid(parsed.error);
  return { instruments: await listInstruments(actor.shopId, { includeInactive: parsed.data.include === "all" }) };
});

/** Register a gauge (admin). */
export const POST = authed(["admin"], async ({ req, actor }) => {
  const input = await readJson(req, instrumentSchema);
  return Response.json({ instrument: await createInstrument(actor, input) }, { status: 201 });
});
