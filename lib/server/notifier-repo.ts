import "server-only";
import { Op, QueryTypes } from "sequelize";
import { Flag, Job, MailOutbox, Release, Shop, User, type Role } from "@/models";
import { getSequelize } from "./db";

// What the notifier reads: releases not yet mailed, flags since the last digest, jobs that may
// have become ready, and who receives each kind of mail. Plain objects out.

export type Recipient = { id: number; name: string; email: string };

export async function recipients(shopId: number, role: Role): Promise<Recipient[]> {
  getSequelize();
  const users = await User.findAll({ where: { shopId, role, active: true }, order: [["id", "ASC"]] });
  return users.map((u) => ({ id: u.id, name: u.name, email: u.email }));
}

/** Standing releases signed since `since` with no build-record mail queued. */
export async function releasesWithoutMail(since: Date): Promise<{ id: number; shopId: number; jobId: number }[]> {
  const rows = await getSequelize().query<{ id: number; shop_id: number; job_id: number }>(
    `SELECT r.id, r.shop_id, r.job_id FROM releases r
       LEFT JOIN mail_outbox m ON m.dedupe_key = CONCAT('build_record:release:', r.id)
      WHERE r.voided_at IS NULL AND r.signed_at >= ? AND m.id IS NULL
      ORDER BY r.id LIMIT 100`,
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

/** The highest flag id the shop's last digest covered, and when it was queued; null before the first. */
export async function lastDigest(shopId: number): Promise<{ maxFlagId: number; at: Date } | null> {
  getSequelize();
  const row = await MailOutbox.findOne({ where: { shopId, kind: "flag_digest" }, order: [["id", "DESC"]] });
  if (!row) return null;
  const payload = typeof row.payload === "string" ? JSON.parse(row.payload) : row.payload;
  return { maxFlagId: Number(payload.maxFlagId ?? 0), at: row.createdAt };
}

export type DigestFlag = {
  id: number; jobCode: string; stationId: string; characteristic: string; value: number; unit: string;
  limitMin: number | null; limitMax: number | null; verdict: string; reason: string; state: string;
};

export async function flagsAfter(shopId: number, after: { id?: number; since?: Date }, limit = 200): Promise<DigestFlag[]> {
  getSequelize();
  const where = after.id !== undefined ? { shopId, id: { [Op.gt]: after.id } } : { shopId, createdAt: { [Op.gte]: after.since! } };
  const flags = await Flag.findAll({ where, order: [["id", "ASC"]], limit });
  const jobs = await Job.findAll({ where: { id: [...new Set(flags.map((f) => f.jobId))], shopId }, attributes: ["id", "code"] });
  const code = new Map(jobs.map((j) => [j.id, j.code]));
  return flags.map((f) => ({
    id: f.id, jobCode: code.get(f.jobId) ?? "", stationId: f.stationId, characteristic: f.characteristic, value: f.value, unit: f.unit,
    limitMin: f.limitMin ?? null, limitMax: f.limitMax ?? null, verdict: f.verdict, reason: f.reason, state: f.state,
  }));
}

export type OpenJob = { id: number; shopId: number; code: string; title: string; specRevision: number };

/** Jobs not released, closed or locked: the ones whose checklist may turn complete. */
export async function openJobs(): Promise<OpenJob[]> {
  getSequelize();
  const jobs = await Job.findAll({ where: { status: ["intake", "measuring", "review"], lockedAt: null }, order: [["id", "ASC"]] });
  return jobs.map((j) => ({ id: j.id, shopId: j.shopId, code: j.code, title: j.title, specRevision: j.specRevision }));
}

export async function releaseCount(jobId: number): Promise<number> {
  getSequelize();
  return Release.count({ where: { jobId } });
}

export async function shopName(shopId: number): Promise<string> {
  getSequelize();
  return (await Shop.findByPk(shopId))?.name ?? "your shop";
}
