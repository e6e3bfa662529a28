import { templateFileSchema } from "@/lib/schemas/spec";
import { AppError } from "@/lib/server/core/errors";
import { authed, readJson } from "@/lib/server/core/route";
import { createTemplate } from "@/lib/server/specs/repo";

// A sheet of 400 limits (the schema's most) is about 120 kB as JSON; anything far larger is not one.
const MAX_BYTES = 1_000_000;

/** A new template from a "tenthwise.spec-template" file; 422 names each path to fix. */
export const POST = authed(["lead", "admin"], async ({ req, actor }) => {
  if (Number(req.headers.get("content-length") ?? 0) > MAX_BYTES) {
    throw new AppError("payload_too_large", "A spec sheet file is at most 1 MB; check that this is the right file");
  }
  const file = await readJson(req, templateFileSchema);
  return Response.json(
    { template: await createTemplate(actor, file.template, "spec_template.import") },
    { status: 201 },
  );
});
