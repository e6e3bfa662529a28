import { templateSchema } from "@/lib/schemas/spec";
import { authed, readJson } from "@/lib/server/core/route";
import { createTemplate, listTemplates } from "@/lib/server/specs/repo";

// Spec sheet templates: the admin manages them and the lead owns spec sheets, so both edit.
export const GET = authed(["lead", "admin"], async ({ actor }) => ({ templates: await listTemplates(actor.shopId) }));

export const POST = authed(["lead", "admin"], async ({ req, actor }) => {
  const values = await readJson(req, templateSchema);
  return Response.json({ template: await createTemplate(actor, values) }, { status: 201 });
});
