import { gradeFileSchema } from "@/lib/schemas/bearing-grades";
import { authed, readJson } from "@/lib/server/core/route";
import { importGrades, listGrades } from "@/lib/server/bearings/grades";

/** The shop's factory grade tables. */
export const GET = authed(["lead", "admin", "inspector"], async ({ actor }) => ({
  tables: await listGrades(actor.shopId),
}));

/** Import a grade table file (format tenthwise.bearing-grades, version 1); same names replace. */
export const POST = authed(["lead"], async ({ req, actor }) => {
  const imported = await importGrades(actor, await readJson(req, gradeFileSchema));
  return { imported, tables: await listGrades(actor.shopId) };
});
