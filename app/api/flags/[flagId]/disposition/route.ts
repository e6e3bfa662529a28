import { disposeFlag } from "@/lib/server/flags/disposition";
import { authed, parseId, readJson } from "@/lib/server/core/route";
import { dispositionSchema } from "@/lib/schemas/flag";

/**
 * The lead decides: { kind: "measure_again", note? } | { kind: "machine_again", operation, note? }
 * | { kind: "accept", reason }. 201 with the flag; 409 when the flag is closed or the job locked.
 */
export const POST = authed<{ flagId: string }>(["lead"], async ({ req, actor, params }) => {
  const id = parseId(params.flagId, "Flag");
  const input = await readJson(req, dispositionSchema);
  return Response.json(await disposeFlag(actor, id, input), { status: 201 });
});
