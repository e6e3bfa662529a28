import { SPEC_FILE_FORMAT, type TemplateFile } from "@/lib/schemas/spec";
import { authed, parseId } from "@/lib/server/core/route";
import { getTemplate } from "@/lib/server/specs/repo";

/** The template as a "tenthwise.spec-template" version 1 file (format in lib/schemas/spec.ts). */
export const GET = authed<{ templateId: string }>(["lead", "admin"], async ({ actor, params }) => {
  const t = await getTemplate(actor.shopId, parseId(params.templateId, "Spec sheet"));
  const file: TemplateFile = {
    format: SPEC_FILE_FORMAT,
    version: 1,
    exportedAt: new Date().toISOString(),
    template: {
      name: t.name,
      engineKind: t.engineKind,
      buildKind: t.buildKind,
      unitSystem: t.unitSystem,
      ...(t.notes ? { notes: t.notes } : {}),
      limits: t.limits,
    },
  };
  const slug =
    t.name
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, "-")
      .replace(/^-|-$/g, "") || "spec-sheet";
  return new Response(`${JSON.stringify(file, null, 2)}\n`, {
    headers: {
      "Content-Type": "application/json; charset=utf-8",
      "Content-Disposition": `attachment; filename="${slug}.tenthwise-spec.json"`,
    },
  });
});
