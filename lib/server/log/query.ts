import "server-only";
import type { AuditEventView, AuditFacets, AuditPage, AuditQuery } from "@/lib/schemas/audit";
import { eventChanges } from "@/lib/server/log/query-summary";
import { auditFacetRows, auditRows, namesAndCodes, type AuditRow } from "@/lib/server/log/repo";

// The audit screen's reads: each event with its user's name, its job's code and before/after
// as a list of changes (log/repo.ts works out each event's job in SQL).

const parse = (v: unknown) => {
  if (typeof v !== "string") return v ?? null;
  try {
    return JSON.parse(v);
  } catch {
    return v;
  }
};

const ids = (values: (number | string | null)[]) => [
  ...new Set(values.filter((x) => x !== null && Number(x) > 0).map(Number)),
];

/** One page of the shop's audit trail, newest first, with before/after as a list of changes. */
export async function queryAudit(shopId: number, q: AuditQuery): Promise<AuditPage> {
  const { total, rows } = await auditRows(shopId, q);
  const { users, jobs } = await namesAndCodes(
    shopId,
    ids(rows.map((r) => r.user_id)),
    ids(rows.map((r) => (r.job_id === null ? null : String(r.job_id)))),
  );
  const events: AuditEventView[] = rows.map((r: AuditRow) => {
    const jobId = r.job_id !== null && Number(r.job_id) > 0 && jobs.has(Number(r.job_id)) ? Number(r.job_id) : null;
    const { changes, truncated } = eventChanges(r.action, parse(r.before), parse(r.after));
    return {
      id: Number(r.id),
      at: r.at,
      userId: r.user_id === null ? null : Number(r.user_id),
      userName: r.user_id === null ? null : (users.get(Number(r.user_id)) ?? null),
      action: r.action,
      entityType: r.entity_type,
      entityId: r.entity_id,
      jobId,
      jobCode: jobId ? (jobs.get(jobId) ?? null) : null,
      changes,
      truncated,
    };
  });
  return { events, page: q.page, pageSize: q.pageSize, total, pages: Math.max(1, Math.ceil(total / q.pageSize)) };
}

/** The values the audit filters can take in this shop. */
export const auditFacets = (shopId: number): Promise<AuditFacets> => auditFacetRows(shopId);
