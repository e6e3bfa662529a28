import "server-only";
import { QueryTypes, type Transaction } from "sequelize";
import type { SyncEntity } from "@/lib/schemas/enums";
import { SETTLE_MS } from "@/lib/schemas/sync";
import { getSequelize, models } from "@/lib/server/core/db";
import { insertMany } from "@/lib/server/core/sql-insert";

// The change feed's one door to the database (sync_changes): one row per changed reading, flag,
// job limit set or job, written in the transaction of the change, and read back by the feed
// (GET /api/sync?since=CURSOR, sync/feed.ts). Plain objects out.

export type ChangeInput = {
  shopId: number;
  jobId: number;
  entity: SyncEntity;
  entityId: string | number;
  deviceId?: string | null;
};

export async function recordChange(t: Transaction | null, c: ChangeInput): Promise<void> {
  await models().SyncChange.create(
    { shopId: c.shopId, jobId: c.jobId, entity: c.entity, entityId: String(c.entityId), deviceId: c.deviceId ?? null },
    { transaction: t ?? undefined },
  );
}

/**
 * recordChange for many rows in one multi-row INSERT inside the caller's transaction (a batch of
 * 100 readings would otherwise cost 100 round trips, bench:sync). Returns the id of the last row
 * written ("0" when none), the push reply's cursor.
 */
export async function recordChanges(t: Transaction, changes: ChangeInput[]): Promise<string> {
  if (changes.length === 0) return "0";
  // The JS clock, as recordChange uses: the feed's settle window is measured on it.
  const now = new Date();
  const firstId = await insertMany(
    t,
    "sync_changes",
    ["shop_id", "job_id", "entity", "entity_id", "device_id", "created_at"],
    changes.map((c) => [c.shopId, c.jobId, c.entity, String(c.entityId), c.deviceId ?? null, now]),
  );
  // One multi-row INSERT takes consecutive auto-increment ids (InnoDB, "simple insert").
  return String(firstId + changes.length - 1);
}

/** The most changes one feed call reads; a full page means "call again". */
export const CHANGE_PAGE = 1000;

export type ChangeRow = {
  id: number | string;
  jobId: number;
  entity: string;
  entityId: string;
  createdAt: Date | string;
};

/** The highest change id of these jobs visible to `t` (the push reply's informational cursor). */
export async function lastChangeId(t: Transaction | undefined, jobIds: number[]): Promise<string> {
  if (jobIds.length === 0) return "0";
  const [row] = await getSequelize().query<{ id: number | string | null }>(
    "SELECT MAX(id) AS id FROM sync_changes WHERE job_id IN (?)",
    { replacements: [jobIds], type: QueryTypes.SELECT, transaction: t },
  );
  return String(row?.id ?? 0);
}

/** The newest settled change of the shop: a job pack read after it is at least that fresh. */
export async function settledCursor(shopId: number): Promise<string> {
  const [row] = await getSequelize().query<{ id: number | string }>(
    "SELECT id FROM sync_changes WHERE shop_id = ? AND created_at < ? ORDER BY id DESC LIMIT 1",
    { replacements: [shopId, new Date(Date.now() - SETTLE_MS)], type: QueryTypes.SELECT },
  );
  return String(row?.id ?? 0);
}

/** Which of these job ids are the shop's. */
export async function ownedJobIds(shopId: number, ids: number[]): Promise<number[]> {
  const rows = await getSequelize().query<{ id: number }>(
    "SELECT id FROM jobs WHERE shop_id = ? AND id IN (?) ORDER BY id",
    { replacements: [shopId, ids], type: QueryTypes.SELECT },
  );
  return rows.map((r) => Number(r.id));
}

/** The next page of changes of these jobs after `since` (at most CHANGE_PAGE rows). */
export async function changesSince(jobIds: number[], since: string): Promise<ChangeRow[]> {
  return getSequelize().query<ChangeRow>(
    `SELECT id, job_id AS jobId, entity, entity_id AS entityId, created_at AS createdAt
       FROM sync_changes WHERE job_id IN (?) AND id > ? ORDER BY id LIMIT ${CHANGE_PAGE}`,
    { replacements: [jobIds, since], type: QueryTypes.SELECT },
  );
}
