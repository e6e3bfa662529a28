import "server-only";
import type { Transaction } from "sequelize";
import type { AuditQuery } from "@/lib/schemas/audit";
import { models } from "@/lib/server/core/db";
import { insertMany } from "@/lib/server/core/sql-insert";
import { settleAll } from "@/lib/server/core/sql-driver";
import { withReads } from "@/lib/server/core/sql-read";

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

// Reads of the append-only audit trail, filtered and paged in the database, straight on the driver
// (core/sql-read.ts): the count and the page go together on one connection. Events carry an
// entity, not a job: each event's job is worked out once, as it is written, by a trigger
// (migration 20261205011000), so a filter by job and the job column read a column. A page's ids
// are found inside one index (shop_id, <filter>, id), newest first, and only its rows are read:
// ordered by the primary key instead, the whole table newer than the shop's events would be walked.
//
// A date range alone walks (shop_id, created_at) backwards instead, newest first by time: ordered
// by id, every event of the range would be read and sorted before the page could be cut from it.
//
// The count stops COUNT_AHEAD events past the page's first row: counting a long-lived shop's whole
// trail on every page would cost more than the page. The screen then says "more than".
export const COUNT_AHEAD = 5000;

// Milliseconds, in UTC (the connection's time zone is +00:00), as ISO 8601.
const AT = `CONCAT(DATE_FORMAT(e.created_at, '%Y-%m-%dT%H:%i:%s.'),
  LPAD(FLOOR(MICROSECOND(e.created_at) / 1000), 3, '0'), 'Z')`;

export type AuditRow = {
  id: number;
  user_id: number | null;
  user_name: string | null;
  action: string;
  entity_type: string;
  entity_id: string;
  before: unknown;
  after: unknown;
  at: string;
  /** The event's job when it is a job of this shop. */
  job_id: number | null;
  job_code: string | null;
};

function where(shopId: number, q: AuditQuery) {
  const parts = ["e.shop_id = ?"];
  const values: unknown[] = [shopId];
  const add = (sql: string, v: unknown) => (parts.push(sql), values.push(v));
  if (q.user) add("e.user_id = ?", q.user);
  if (q.action) add("e.action = ?", q.action);
  if (q.entity) add("e.entity_type = ?", q.entity);
  if (q.entityId) add("e.entity_id = ?", q.entityId);
  if (q.from) add("e.created_at >= ?", `${q.from} 00:00:00.000`);
  if (q.to) add("e.created_at < DATE_ADD(?, INTERVAL 1 DAY)", q.to);
  if (q.job) add("e.job_id = ?", q.job);
  const byTime = (q.from || q.to) && !q.user && !q.action && !q.entity && !q.entityId && !q.job;
  const order = byTime ? "e.created_at DESC, e.id DESC" : "e.id DESC";
  const cond = parts.join(" AND ");
  return {
    sql: `FROM audit_events e WHERE ${cond}`,
    page: `FROM audit_events e ${pageIndex(q, !!byTime)} WHERE ${cond}`,
    values,
    order,
  };
}

// The page's index is named, not left to the optimizer: for `ORDER BY id DESC LIMIT n` with a
// filter many of the shop's events match (none, or an entity type), MariaDB chose to walk the
// primary key backwards past every newer event of every other shop (0.4 s at 1M readings).
const FILTER_INDEXES: [filter: "job" | "entity" | "action" | "user", index: string][] = [
  ["job", "audit_events_shop_job"],
  ["entity", "audit_events_shop_entity"],
  ["action", "audit_events_shop_action"],
  ["user", "audit_events_shop_user"],
];
function pageIndex(q: AuditQuery, byTime: boolean): string {
  const filtered = FILTER_INDEXES.find(([filter]) => q[filter]);
  const name = byTime ? "audit_events_shop_created" : (filtered?.[1] ?? "audit_events_shop_order");
  return `FORCE INDEX (${name})`;
}

/**
 * One page of the shop's events matching `q`, newest first, with each one's user name and job
 * code, and how many match: exact, or at least `total` when `more` (the count stopped there).
 */
export async function auditRows(
  shopId: number,
  q: AuditQuery,
): Promise<{ total: number; more: boolean; rows: AuditRow[] }> {
  const { sql, page, values, order } = where(shopId, q);
  const offset = (q.page - 1) * q.pageSize;
  const cap = offset + COUNT_AHEAD;
  const [[count], rows] = await withReads((read) =>
    settleAll([
      read<{ n: number }>(`SELECT COUNT(*) AS n FROM (SELECT 1 ${sql} LIMIT ?) counted`, [...values, cap + 1]),
      read<AuditRow>(
        `SELECT e.id, e.user_id, u.name AS user_name, e.action, e.entity_type, e.entity_id, e.before, e.after,
           ${AT} AS at, j.id AS job_id, j.code AS job_code
         FROM (SELECT e.id ${page} ORDER BY ${order} LIMIT ? OFFSET ?) page
           JOIN audit_events e ON e.id = page.id
           LEFT JOIN users u ON u.id = e.user_id AND u.shop_id = e.shop_id
           LEFT JOIN jobs j ON j.id = e.job_id AND j.shop_id = e.shop_id
         ORDER BY ${order}`,
        [...values, q.pageSize, offset],
      ),
    ]),
  );
  const n = Number(count?.n ?? 0);
  return { total: Math.min(n, cap), more: n > cap, rows };
}

/** The values the audit filters can take in this shop (read together on one connection). */
export async function auditFacetRows(shopId: number) {
  const distinct = (col: "action" | "entity_type") =>
    `SELECT DISTINCT ${col} AS v FROM audit_events WHERE shop_id = ? ORDER BY v`;
  const [actions, entities, users, jobs] = await withReads((read) =>
    settleAll([
      read<{ v: string }>(distinct("action"), [shopId]),
      read<{ v: string }>(distinct("entity_type"), [shopId]),
      read<{ id: number; name: string }>("SELECT id, name FROM users WHERE shop_id = ? ORDER BY name", [shopId]),
      read<{ id: number; code: string; title: string }>(
        "SELECT id, code, title FROM jobs WHERE shop_id = ? ORDER BY code",
        [shopId],
      ),
    ]),
  );
  return {
    actions: actions.map((a) => a.v),
    entities: entities.map((e) => e.v),
    users: users.map((u) => ({ id: u.id, name: u.name })),
    jobs: jobs.map((j) => ({ id: j.id, code: j.code, title: j.title })),
  };
}
