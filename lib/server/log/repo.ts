import "server-only";
import { QueryTypes, type Transaction } from "sequelize";
import type { AuditQuery } from "@/lib/schemas/audit";
import { getSequelize, models } from "@/lib/server/core/db";
import { insertMany } from "@/lib/server/core/sql-insert";

// The audit trail's one door to the database: writing events (one, or many in one INSERT) and
// reading them back filtered and paged. Plain objects out.
//
// Every change is an append-only audit event written in the same transaction as the change
// itself, so the trail can never disagree with the data. The table refuses UPDATE and DELETE.
export type AuditInput = {
  shopId: number;
  userId: number | null;
  action: string;
  entityType: string;
  entityId: string | number;
  before?: unknown;
  after?: unknown;
};

const plain = (v: unknown) => (v === undefined ? null : JSON.parse(JSON.stringify(v)));

export async function recordAudit(t: Transaction | null, e: AuditInput): Promise<void> {
  await models().AuditEvent.create(
    {
      shopId: e.shopId,
      userId: e.userId,
      action: e.action,
      entityType: e.entityType,
      entityId: String(e.entityId),
      before: plain(e.before),
      after: plain(e.after),
    },
    { transaction: t ?? undefined },
  );
}

const json = (v: unknown) => (v === undefined || v === null ? null : JSON.stringify(v));

/**
 * recordAudit for many events at once: the same rows, written by one multi-row INSERT inside the
 * caller's transaction. A batch of 100 readings would otherwise cost 100 round trips (bench:sync).
 */
export async function recordAudits(t: Transaction, events: AuditInput[]): Promise<void> {
  if (events.length === 0) return;
  const now = new Date();
  await insertMany(
    t,
    "audit_events",
    ["shop_id", "user_id", "action", "entity_type", "entity_id", "before", "after", "created_at"],
    events.map((e) => [
      e.shopId,
      e.userId,
      e.action,
      e.entityType,
      String(e.entityId),
      json(e.before),
      json(e.after),
      now,
    ]),
  );
}

// Reads of the append-only audit trail, filtered and paged in the database. Events carry an
// entity, not a job: each event's job is worked out once, as it is written, by a trigger
// (migration 20261205011000), so a filter by job and the job column read a column. A page's ids
// are found inside one index (shop_id, <filter>, id), newest first, and only its rows are read:
// ordered by the primary key instead, the whole table newer than the shop's events would be walked.

// Milliseconds, in UTC (the connection's time zone is +00:00), as ISO 8601.
const AT = `CONCAT(DATE_FORMAT(e.created_at, '%Y-%m-%dT%H:%i:%s.'),
  LPAD(FLOOR(MICROSECOND(e.created_at) / 1000), 3, '0'), 'Z')`;

export type AuditRow = {
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
  if (q.job) {
    parts.push("e.job_id = :job");
    r.job = q.job;
  }
  return { sql: `FROM audit_events e WHERE ${parts.join(" AND ")}`, replacements: r };
}

/** One page of the shop's events matching `q`, newest first, and how many match in all. */
export async function auditRows(shopId: number, q: AuditQuery): Promise<{ total: number; rows: AuditRow[] }> {
  const sequelize = getSequelize();
  const { sql, replacements } = where(shopId, q);
  const columns = `e.id, e.user_id, e.action, e.entity_type, e.entity_id, e.before, e.after, ${AT} AS at, e.job_id`;
  const [[{ n }], rows] = await Promise.all([
    sequelize.query<{ n: number | string | bigint }>(`SELECT COUNT(*) AS n ${sql}`, {
      type: QueryTypes.SELECT,
      replacements,
    }),
    sequelize.query<AuditRow>(
      `SELECT ${columns} FROM (SELECT e.id ${sql} ORDER BY e.id DESC LIMIT :limit OFFSET :offset) page
        JOIN audit_events e ON e.id = page.id ORDER BY e.id DESC`,
      {
        type: QueryTypes.SELECT,
        replacements: { ...replacements, limit: q.pageSize, offset: (q.page - 1) * q.pageSize },
      },
    ),
  ]);
  return { total: Number(n), rows };
}

/** Names of these users and codes of these jobs, of this shop only. */
export async function namesAndCodes(shopId: number, userIds: number[], jobIds: number[]) {
  const { Job, User } = models();
  const [users, jobs] = await Promise.all([
    userIds.length ? User.findAll({ where: { id: userIds, shopId }, attributes: ["id", "name"] }) : [],
    jobIds.length ? Job.findAll({ where: { id: jobIds, shopId }, attributes: ["id", "code"] }) : [],
  ]);
  return { users: new Map(users.map((u) => [u.id, u.name])), jobs: new Map(jobs.map((j) => [j.id, j.code])) };
}

/** The values the audit filters can take in this shop. */
export async function auditFacetRows(shopId: number) {
  const { Job, User } = models();
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
