import { auditQuerySchema } from "@/lib/schemas/audit";
import { queryAudit } from "@/lib/server/log/query";
import { invalid } from "@/lib/server/core/errors";
import { authed } from "@/lib/server/core/route";
import { AUDIT_ROLES } from "@/lib/schemas/enums";

/** The shop's audit trail, filtered and paged (contract: lib/schemas/audit.ts). */
export const GET = authed(AUDIT_ROLES, async ({ req, actor }) => {
  const parsed = auditQuerySchema.safeParse(Object.fromEntries(new URL(req.url).searchParams));
  if (!parsed.success) throw invalid(parsed.error, "Some filters need fixing");
  return queryAudit(actor.shopId, parsed.data);
});
