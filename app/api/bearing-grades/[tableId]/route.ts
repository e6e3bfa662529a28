import { authed, parseId } from "@/lib/server/core/route";
import { listGrades, removeGrades } from "@/lib/server/bearings/grades";

type P = { tableId: string };

export const DELETE = authed<P>(["lead"], async ({ actor, params }) => {
  await removeGrades(actor, parseId(params.tableId, "Grade table"));
  return { tables: await listGrades(actor.shopId) };
});
