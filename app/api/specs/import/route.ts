import { templateFileSchema } from "@/lib/schemas/spec";
import { authed, readJson } from "@/lib/server/route";
import { createTemplate } from "@/lib/server/specs-repo";

/** A new template from a "tenthwise.spec-template" file; 422 names each path to fix. */
export const POST = authed(["lead", "admin"], async ({ req, actor }) => {
  const file = await readJson(req, templateFileSchema);
  return Response.json({ template: await createTemplate(actor, file.template, "spec_template.import") }, { status: 201 });
});
