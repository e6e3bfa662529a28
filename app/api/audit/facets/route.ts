import { auditFacets } from "@/lib/server/log/query";
import { authed } from "@/lib/server/core/route";
import { AUDIT_ROLES } from "@/lib/schemas/enums";

/** The actions, entities, people and jobs the audit filters can pick from. */
export const GET = authed(AUDIT_ROLES, async ({ actor }) => auditFacets(actor.shopId));
