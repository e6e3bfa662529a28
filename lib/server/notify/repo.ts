import "server-only";
import { Op, QueryTypes } from "sequelize";
import { getSequelize, models } from "@/lib/server/core/db";
import { causalRows } from "@/lib/server/core/cluster";
import { utcDate } from "@/lib/server/core/sql-driver";
import type { Role } from "@/lib/schemas/enums";
import { releaseMailKeySql } from "@/lib/server/mail/outbox";

// What the notifier reads: releases not yet mailed, flags since the last digest, jobs that may
// have become ready, and who receives each kind of mail. Plain objects out. (The notifier is
// the mail feature's background half; its queries are kept apart from the outbox's.)

export type Recipient = { id: number; name: string; email: string };

export async function recipients(shopId: number, role: Role): Promise<Recipient[]> {
  const { User } = models();
  const users = await User.findAll({ where: { shopId, role, active: true }, order: [["id", "ASC"]] });
  return users.map((u) => ({ id: u.id, name: u.name, email: u.email }));
}

/**
 * Standing releases signed since `since` with no build-record mail queued, in one query: the
 * outbox is joined on the same key the sign transaction queues under (releaseMailKey).
 */
export async function releasesWithoutMail(since: Date): Promise<{ id: number; shopId: number; jobId: number }[]> {
  const sequelize = getSequelize();
  const key = releaseMailKeySql("r.id", (text) => sequelize.escape(text));
  const rows = await sequelize.query<{ id: number; shop_id: number; job_id: number }>(
    `SELECT r.id, r.shop_id, r.job_id FROM releases r
       LEFT JOIN mail_outbox m ON m.dedupe_key = ${key}
      WHERE r.voided_at IS NULL AND r.signed_at >= ? AND m.id IS NULL
      ORDER BY r.id DESC LIMIT 100`,
    { replacements: [since], type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ id: Number(r.id), shopId: Number(r.shop_id), jobId: Number(r.job_id) }));
}

export async function shopsWithFlagsSince(since: Date): Promise<number[]> {
  const rows = await getSequelize().query<{ shop_id: number }>(
    "SELECT DISTINCT shop_id FROM flags WHERE created_at >= ? ORDER BY shop_id",
    { replacements: [since], type: QueryTypes.SELECT },
  );
  return rows.map((r) => Number(r.shop_id));
}

/** A digest queued before: its round, when, and which flags it listed. */
export type PastDigest = { round: number; at: Date; flagIds: number[] };

const digestOf = (row: { payload: unknown; createdAt: Date }): PastDigest => {
  const p = (typeof row.payload === "string" ? JSON.parse(row.payload) : row.payload) as Record<string, unknown>;
  const ids = Array.isArray(p.flagIds) ? p.flagIds.map(Number) : [];
  return { round: Number(p.round ?? 0), at: row.createdAt, flagIds: ids };
};

/**
 * The shop's digests from its latest round back to `from` (the latest only when `from` is absent),
 * latest first; empty before the first. By round, not by row id: on a cluster a later row can carry
 * a lower id. A causal read (core/cluster.ts), so a digest queued through another node is seen.
 */
export async function pastDigests(shopId: number, from?: Date): Promise<PastDigest[]> {
  const rows = await causalRows<{ payload: unknown; createdAt: unknown }>(
    null,
    `SELECT payload, created_at AS createdAt FROM mail_outbox
      WHERE shop_id = ? AND kind = 'flag_digest' ${from ? "AND created_at >= ?" : ""}
      ORDER BY COALESCE(CAST(JSON_VALUE(payload, '$.round') AS UNSIGNED), 0) DESC, id DESC ${from ? "" : "LIMIT 1"}`,
    from ? [shopId, from] : [shopId],
  );
  return rows.map((r) => digestOf({ payload: r.payload, createdAt: utcDate(r.createdAt)! }));
}

export type DigestFlag = {
  id: number;
  jobCode: string;
  stationId: string;
  characteristic: string;
  value: number;
  unit: string;
  limitMin: number | null;
  limitMax: number | null;
  verdict: string;
  reason: string;
  state: string;
};

/** The shop's flags raised since `since` that are not among `except` (listed by an earlier digest). */
export async function flagsSince(shopId: number, since: Date, except: number[], limit = 200): Promise<DigestFlag[]> {
  const { Flag, Job } = models();
  const where = { shopId, createdAt: { [Op.gte]: since }, ...(except.length ? { id: { [Op.notIn]: except } } : {}) };
  const flags = await Flag.findAll({ where, order: [["id", "ASC"]], limit });
  const jobs = await Job.findAll({
    where: { id: [...new Set(flags.map((f) => f.jobId))], shopId },
    attributes: ["id", "code"],
  });
  const code = new Map(jobs.map((j) => [j.id, j.code]));
  return flags.map((f) => ({
    id: f.id,
    jobCode: code.get(f.jobId) ?? "",
    stationId: f.stationId,
    characteristic: f.characteristic,
    value: f.value,
    unit: f.unit,
    limitMin: f.limitMin ?? null,
    limitMax: f.limitMax ?? null,
    verdict: f.verdict,
    reason: f.reason,
    state: f.state,
  }));
}

export type OpenJob = { id: number; shopId: number; code: string; title: string; specRevision: number };

const OPEN = "j.status IN ('intake', 'measuring', 'review') AND j.locked_at IS NULL";
const toOpenJob = (j: {
  id: number;
  shop_id: number;
  code: string;
  title: string;
  spec_revision: number;
}): OpenJob => ({
  id: Number(j.id),
  shopId: Number(j.shop_id),
  code: j.code,
  title: j.title,
  specRevision: Number(j.spec_revision),
});

/** How far the notifier has read each shop's change feed: shop id → the last seq it read. */
export type FeedCursors = ReadonlyMap<number, number>;

/**
 * Each shop's changes numbered after its cursor and up to its counter as read here: a counter
 * value is seen only once every change numbered up to it has committed (migrations/20261204020000),
 * so the ranges neither skip nor repeat a change. A shop with no cursor is new since: all of it.
 */
function feedRanges(counters: FeedCursors, cursors: FeedCursors) {
  return [...counters].flatMap(([shopId, to]) => {
    const from = cursors.get(shopId) ?? 0;
    return to > from ? [{ shopId, from, to }] : [];
  });
}

/**
 * Open jobs (not released, closed or locked) touched since the cursors: a change in a shop's sync
 * feed (readings, flags, limits) after its cursor, or an edit of the job row (plan, status) since
 * `at`. With no cursors yet (the first pass), feed changes since `at` count. Also returns the
 * cursors to pass next time.
 */
export async function changedOpenJobs(since: {
  feed: FeedCursors | null;
  at: Date;
}): Promise<{ jobs: OpenJob[]; feed: FeedCursors }> {
  const sequelize = getSequelize();
  const counters = await sequelize.query<{ shop_id: number; seq: number | string }>(
    "SELECT shop_id, seq FROM sync_sequences",
    { type: QueryTypes.SELECT },
  );
  const feed = new Map(counters.map((c) => [Number(c.shop_id), Number(c.seq)]));
  const ranges = since.feed ? feedRanges(feed, since.feed) : [];
  const replacements: Record<string, unknown> = { at: since.at };
  ranges.forEach((r, i) => Object.assign(replacements, { [`s${i}`]: r.shopId, [`f${i}`]: r.from, [`t${i}`]: r.to }));
  const inFeed = since.feed
    ? ranges.map((_, i) => `(shop_id = :s${i} AND seq > :f${i} AND seq <= :t${i})`).join(" OR ")
    : "created_at >= :at";
  const fromFeed = inFeed ? ` OR j.id IN (SELECT job_id FROM sync_changes WHERE ${inFeed})` : "";
  const rows = await sequelize.query<Parameters<typeof toOpenJob>[0]>(
    `SELECT j.id, j.shop_id, j.code, j.title, j.spec_revision FROM jobs j
      WHERE ${OPEN} AND (j.updated_at >= :at${fromFeed})
      ORDER BY j.id DESC LIMIT 500`,
    { replacements, type: QueryTypes.SELECT },
  );
  return { jobs: rows.map(toOpenJob), feed };
}

/** The next `limit` open jobs after `afterId`, wrapping round to the lowest id. */
export async function openJobsAfter(afterId: number, limit: number): Promise<OpenJob[]> {
  const page = (where: string) =>
    getSequelize().query<Parameters<typeof toOpenJob>[0]>(
      `SELECT j.id, j.shop_id, j.code, j.title, j.spec_revision FROM jobs j
        WHERE ${OPEN} ${where} ORDER BY j.id LIMIT ${Number(limit)}`,
      { replacements: [afterId], type: QueryTypes.SELECT },
    );
  const rows = await page("AND j.id > ?");
  if (rows.length < limit && afterId > 0) rows.push(...(await page("AND j.id <= ?")).slice(0, limit - rows.length));
  return rows.map(toOpenJob);
}

export async function releaseCount(jobId: number): Promise<number> {
  const { Release } = models();
  return Release.count({ where: { jobId } });
}

export async function shopName(shopId: number): Promise<string> {
  const { Shop } = models();
  return (await Shop.findByPk(shopId))?.name ?? "your shop";
}
