import "server-only";
import type { AuditEventView, AuditFacets, AuditPage, AuditQuery } from "@/lib/schemas/audit";
import { eventChanges } from "@/lib/server/log/query-summary";
import { auditFacetRows, auditRows, type AuditRow } from "@/lib/server/log/repo";

// The audit screen's reads: each event with its user's name, its job's code and before/after
// as a list of changes (log/repo.ts reads the names and codes with the page, in SQL).

const parse = (v: unknown) => {
  if (typeof v !== "string") return v ?? null;
  try {
    return JSON.parse(v);
  } catch {
    return v;
  }
};

/** One page of the shop's audit trail, newest first, with before/after as a list of changes. */
export async function queryAudit(shopId: number, q: AuditQuery): Promise<AuditPage> {
  const { total, more, rows } = await auditRows(shopId, q);
  const events: AuditEventView[] = rows.map((r: AuditRow) => {
    const { changes, truncated } = eventChanges(r.action, parse(r.before), parse(r.after));
    return {
      id: Number(r.id),
      at: r.at,
      userId: r.user_id === null ? null : Number(r.user_id),
      userName: r.user_name ?? null,
      action: r.action,
      entityType: r.entity_type,
      entityId: r.entity_id,
      jobId: r.job_id === null ? null : Number(r.job_id),
      jobCode: r.job_id === null ? null : r.job_code,
      changes,
      truncated,
    };
  });
  const pages = Math.max(1, Math.ceil(total / q.pageSize));
  return { events, page: q.page, pageSize: q.pageSize, total, more, pages };
}

/** The values the audit filters can take in this shop. */
export const auditFacets = (shopId: number): Promise<AuditFacets> => auditFacetRows(shopId);
