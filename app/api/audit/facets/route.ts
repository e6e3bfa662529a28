import { auditFacets } from "@/lib/server/log/query";
import { authed } from "@/lib/server/core/route";

/** The actions, entities, people and jobs the audit filters can pick from. */
export const GET = authed(["lead", "inspector"], async ({ actor }) => auditFacets(actor.shopId));
