import { invalid } from "@/lib/server/core/errors";
import { listFlags } from "@/lib/server/flags/list";
import { authed } from "@/lib/server/core/route";
import { flagListQuerySchema } from "@/lib/schemas/flag";

/**
 * The flag queue (lead; inspector reads): ?page=&pageSize=&sort=&dir=&state=&job=&verdict=&reason=
 * → { items, total, page, pageSize, pageCount }. Bad parameters are 422 naming the parameter.
 */
export const GET = authed(["lead", "inspector"], async ({ req, actor }) => {
  const parsed = flagListQuerySchema.safeParse(Object.fromEntries(new URL(req.url).searchParams));
  if (!parsed.success) throw invalid(parsed.error, "Some filters need fixing");
  return listFlags(actor.shopId, parsed.data);
});
