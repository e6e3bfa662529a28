import { z } from "zod";
import { templateSchema } from "@/lib/schemas/spec";
import { authed, parseId, readJson } from "@/lib/server/core/route";
import { getTemplate, jobsFromTemplate, setTemplateArchived, updateTemplate } from "@/lib/server/specs/repo";

type P = { templateId: string };
const idOf = (p: P) => parseId(p.templateId, "Spec sheet");

export const GET = authed<P>(["lead", "admin"], async ({ actor, params }) => {
  const id = idOf(params);
  const template = await getTemplate(actor.shopId, id);
  return { template, jobCount: await jobsFromTemplate(actor.shopId, id) };
});

/** Replace the whole sheet (header and limits); the version goes up by one. */
export const PUT = authed<P>(["lead", "admin"], async ({ req, actor, params }) => {
  const id = idOf(params);
  const values = await readJson(req, templateSchema);
  return { template: await updateTemplate(actor, id, values) };
});

const archiveSchema = z.strictObject({ archived: z.boolean({ error: "Say archived: true or false" }) });

/** Archive or restore. Archived sheets cannot start new jobs. */
export const PATCH = authed<P>(["lead", "admin"], async ({ req, actor, params }) => {
  const id = idOf(params);
  const { archived } = await readJson(req, archiveSchema);
  return { template: await setTemplateArchived(actor, id, archived) };
});
