import "server-only";
import { QueryTypes } from "sequelize";
import type { AuditEventView, AuditFacets, AuditPage, AuditQuery } from "@/lib/schemas/audit";
import { Job, User } from "@/models";
import { eventChanges } from "@/lib/server/log/query-summary";
import { getSequelize } from "@/lib/server/core/db";

// Reads of the append-only audit trail, filtered and paged in the database. Events carry an
// entity, not a job, so each event's job is worked out in SQL: the job itself, the job of a
// reading / flag / release / attachment, else a jobId written in the event's after or before.

const JOB_OF_EVENT = `CAST(CASE e.entity_type
  WHEN 'job' THEN e.entity_id
  WHEN 'job_limits' THEN e.entity_id
  WHEN 'reading' THEN (SELECT r.job_id FROM readings r WHERE r.id = e.entity_id AND r.shop_id = e.shop_id)
  WHEN 'flag' THEN (SELECT f.job_id FROM flags f WHERE f.id = CAST(e.entity_id AS UNSIGNED) AND f.shop_id = e.shop_id)
  WHEN 'release' THEN (SELECT rl.job_id FROM releases rl WHERE rl.id = CAST(e.entity_id AS UNSIGNED) AND rl.shop_id = e.shop_id)
  WHEN 'attachment' THEN CASE JSON_VALUE(e.after, '$.ownerType')
    WHEN 'job' THEN JSON_VALUE(e.after, '$.ownerId')
    WHEN 'reading' THEN (SELECT r2.job_id FROM readings r2 WHERE r2.id = JSON_VALUE(e.after, '$.ownerId') AND r2.shop_id = e.shop_id)
    END
  ELSE COALESCE(JSON_VALUE(e.after, '$.jobId'), JSON_VALUE(e.before, '$.jobId'))
END AS UNSIGNED)`;

// Milliseconds, in UTC (the connection's time zone is +00:00), as ISO 8601.
const AT = `CONCAT(DATE_FORMAT(e.created_at, '%Y-%m-%dT%H:%i:%s.'), LPAD(FLOOR(MICROSECOND(e.created_at) / 1000), 3, '0'), 'Z')`;

type Row = {
  id: number | string | bigint;
  user_id: number | null;
  action: string;
  entity_type: string;
  entity_id: string;
  before: unknown;
  after: unknown;
  at: string;
  job_id: number | string | null;
};

function where(shopId: number, q: AuditQuery) {
  const parts = ["e.shop_id = :shop"];
  const r: Record<string, unknown> = { shop: shopId };
  if (q.user) {
    parts.push("e.user_id = :user");
    r.user = q.user;
  }
  if (q.action) {
    parts.push("e.action = :action");
    r.action = q.action;
  }
  if (q.entity) {
    parts.push("e.entity_type = :entity");
    r.entity = q.entity;
  }
  if (q.entityId) {
    parts.push("e.entity_id = :entityId");
    r.entityId = q.entityId;
  }
  if (q.from) {
    parts.push("e.created_at >= :from");
    r.from = `${q.from} 00:00:00.000`;
  }
  if (q.to) {
    parts.push("e.created_at < DATE_ADD(:to, INTERVAL 1 DAY)");
    r.to = q.to;
  }
  const inner = `SELECT e.id, e.user_id, e.action, e.entity_type, e.entity_id, e.before, e.after, ${AT} AS at, ${JOB_OF_EVENT} AS job_id
    FROM audit_events e WHERE ${parts.join(" AND ")}`;
  if (q.job) r.job = q.job;
  return { sql: `FROM (${inner}) x${q.job ? " WHERE x.job_id = :job" : ""}`, replacements: r };
}

const parse = (v: unknown) => {
  if (typeof v !== "string") return v ?? null;
  try {
    return JSON.parse(v);
  } catch {
    return v;
  }
};

async function namesAndCodes(shopId: number, rows: Row[]) {
  const userIds = [
    ...new Set(
      rows
        .map((r) => r.user_id)
        .filter((x): x is number => x !== null)
        .map(Number),
    ),
  ];
  const jobIds = [
    ...new Set(
      rows
        .map((r) => r.job_id)
        .filter((x) => x !== null && Number(x) > 0)
        .map(Number),
    ),
  ];
  const [users, jobs] = await Promise.all([
    userIds.length ? User.findAll({ where: { id: userIds, shopId }, attributes: ["id", "name"] }) : [],
    jobIds.length ? Job.findAll({ where: { id: jobIds, shopId }, attributes: ["id", "code"] }) : [],
  ]);
  return { users: new Map(users.map((u) => [u.id, u.name])), jobs: new Map(jobs.map((j) => [j.id, j.code])) };
}

/** One page of the shop's audit trail, newest first, with before/after as a list of changes. */
export async function queryAudit(shopId: number, q: AuditQuery): Promise<AuditPage> {
  const sequelize = getSequelize();
  const { sql, replacements } = where(shopId, q);
  const [{ n }] = await sequelize.query<{ n: number | string | bigint }>(`SELECT COUNT(*) AS n ${sql}`, {
    type: QueryTypes.SELECT,
    replacements,
  });
  const total = Number(n);
  const rows = await sequelize.query<Row>(`SELECT x.* ${sql} ORDER BY x.id DESC LIMIT :limit OFFSET :offset`, {
    type: QueryTypes.SELECT,
    replacements: { ...replacements, limit: q.pageSize, offset: (q.page - 1) * q.pageSize },
  });
  const { users, jobs } = await namesAndCodes(shopId, rows);
  const events: AuditEventView[] = rows.map((r) => {
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
export async function auditFacets(shopId: number): Promise<AuditFacets> {
  const sequelize = getSequelize();
  const distinct = (col: "action" | "entity_type") =>
    sequelize.query<{ v: string }>(`SELECT DISTINCT ${col} AS v FROM audit_events WHERE shop_id = :shop ORDER BY v`, {
      type: QueryTypes.SELECT,
      replacements: { shop: shopId },
    });
  const [actions, entities, users, jobs] = await Promise.all([
    distinct("action"),
    distinct("entity_type"),
    User.findAll({ where: { shopId }, attributes: ["id", "name"], order: [["name", "ASC"]] }),
    Job.findAll({ where: { shopId }, attributes: ["id", "code", "title"], order: [["code", "ASC"]] }),
  ]);
  return {
    actions: actions.map((a) => a.v),
    entities: entities.map((e) => e.v),
    users: users.map((u) => ({ id: u.id, name: u.name })),
    jobs: jobs.map((j) => ({ id: j.id, code: j.code, title: j.title })),
  };
}
