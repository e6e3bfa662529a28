import { studySettingsSchema } from "@/lib/schemas/gauge-studies";
import { authed, readJson } from "@/lib/server/core/route";
import { getStudySettings } from "@/lib/server/gauge-studies/repo";
import { updateStudySettings } from "@/lib/server/gauge-studies/settings";

/** The shop's pass marks for gauge studies and how long a study stays current. */
export const GET = authed(["admin", "lead", "inspector"], async ({ actor }) => ({
  settings: await getStudySettings(actor.shopId),
}));

/** Change them (admin); studies saved from now on are judged by the new marks. */
export const PUT = authed(["admin"], async ({ req, actor }) => {
  const next = await readJson(req, studySettingsSchema);
  return { settings: await updateStudySettings(actor, next) };
});
