import "server-only";
import { QueryTypes, type Transaction } from "sequelize";
import type { SyncEntity } from "@/lib/schemas/enums";
import { getSequelize, models } from "@/lib/server/core/db";
import { insertMany, insertSql } from "@/lib/server/core/sql-insert";
import { settleAll, sqlRows, sqlWrite } from "@/lib/server/core/sql-driver";
import { readRows } from "@/lib/server/core/sql-read";

// The change feed's one door to the database (sync_changes): one row per changed reading, flag,
// job limit set or job, written in the transaction of the change, and read back by the feed
// (GET /api/sync?since=CURSOR, sync/feed.ts). Each row carries its shop's sequence number (seq), which
// follows commit order on every node (migrations/20261204020000 says how); the cursor is a seq.
// Plain objects out.

export type ChangeInput = {
  shopId: number;
  jobId: number;
  entity: SyncEntity;
  entityId: string | number;
  deviceId?: string | null;
};

const CHANGE_COLUMNS = ["shop_id", "job_id", "entity", "entity_id", "device_id", "created_at"];
function changeRows(changes: ChangeInput[]): unknown[][] {
  const now = new Date();
  return changes.map((c) => [c.shopId, c.jobId, c.entity, String(c.entityId), c.deviceId ?? null, now]);
}

export async function recordChange(t: Transaction | null, c: ChangeInput): Promise<void> {
  await models().SyncChange.create(
    { shopId: c.shopId, jobId: c.jobId, entity: c.entity, entityId: String(c.entityId), deviceId: c.deviceId ?? null },
    { transaction: t ?? undefined },
  );
}

/**
 * recordChange for many rows in one multi-row INSERT inside the caller's transaction (a batch of
 * 100 readings would otherwise cost 100 round trips, bench:sync). The trigger numbers them from
 * the shop's sequence and holds its row until commit, so every writer of the shop's feed waits
 * from this INSERT to our commit: callers write changes last and commit straight after. The
 * sequence is read in the same round trip (a read may wait behind a write in a pipeline,
 * sql-driver.ts). Returns the shop's sequence after them ("0" when none), the push reply's cursor.
 */
export async function recordChanges(t: Transaction, changes: ChangeInput[]): Promise<string> {
  if (changes.length === 0) return "0";
  const inserting = insertMany(t, "sync_changes", CHANGE_COLUMNS, changeRows(changes));
  const sequence = sqlRows<{ seq: number }>(t, "SELECT seq FROM sync_sequences WHERE shop_id = ?", [
    changes.at(-1)!.shopId,
  ]);
  const [, [row]] = await settleAll([inserting, sequence]);
  return String(row?.seq ?? 0);
}

/**
 * recordChanges and COMMIT as ONE statement on the server (a compound statement), for a caller with
 * nothing left to do but commit: the shop's counter row is then held for the insert and the commit
 * only, never for a turn of our busy event loop or another round trip (bench:burst saw batches
 * queue on that row). Any error inside rolls the whole transaction back and is raised as it was
 * (1213 at a Galera commit stays 1213, so the batch runs again). The cursor is kept in a session
 * variable, read in the same round trip. Sequelize's own COMMIT after it finds nothing to commit.
 */
export async function recordChangesAndCommit(t: Transaction, changes: ChangeInput[]): Promise<string> {
  if (changes.length === 0) return "0";
  const rows = changeRows(changes);
  const block = `BEGIN NOT ATOMIC
      DECLARE EXIT HANDLER FOR SQLEXCEPTION BEGIN ROLLBACK; RESIGNAL; END;
      SET @tw_feed_seq = NULL;
      ${insertSql("sync_changes", CHANGE_COLUMNS, rows.length)};
      SELECT seq INTO @tw_feed_seq FROM sync_sequences WHERE shop_id = ?;
      COMMIT;
    END`;
  const committing = sqlWrite(t, block, [...rows.flat(), changes.at(-1)!.shopId]);
  const sequence = sqlRows<{ seq: number | null }>(t, "SELECT @tw_feed_seq AS seq");
  const [, [row]] = await settleAll([committing, sequence]);
  return String(row?.seq ?? 0);
}

/** The most changes one feed call reads; a full page means "call again". */
export const CHANGE_PAGE = 1000;

export type ChangeRow = {
  seq: number | string;
  jobId: number;
  entity: string;
  entityId: string;
};

/** The highest change number of these jobs visible to `t` (the push reply's informational cursor). */
export async function lastChangeId(t: Transaction | undefined, jobIds: number[]): Promise<string> {
  if (jobIds.length === 0) return "0";
  const [row] = await getSequelize().query<{ seq: number | string | null }>(
    "SELECT MAX(seq) AS seq FROM sync_changes WHERE job_id IN (?)",
    { replacements: [jobIds], type: QueryTypes.SELECT, transaction: t },
  );
  return String(row?.seq ?? 0);
}

/**
 * The shop's sequence as this node has it now: every change numbered up to it is committed and
 * visible here (migrations/20261204020000), so a job pack read after it is at least that fresh.
 */
export async function currentCursor(shopId: number): Promise<string> {
  const [row] = await getSequelize().query<{ seq: number | string }>(
    "SELECT seq FROM sync_sequences WHERE shop_id = ?",
    { replacements: [shopId], type: QueryTypes.SELECT },
  );
  return String(row?.seq ?? 0);
}

/**
 * The next page of changes of these jobs of the shop numbered after `since` (at most CHANGE_PAGE
 * rows); another shop's job ids find nothing. The index is named: offered (shop_id, seq), the
 * planner walks the whole shop's feed in seq order to skip the sort, where (job_id, seq) reads
 * only these jobs' rows after the cursor (bench:scale's EXPLAIN).
 */
export async function changesSince(shopId: number, jobIds: number[], since: string): Promise<ChangeRow[]> {
  if (jobIds.length === 0) return [];
  return readRows<ChangeRow>(
    `SELECT seq, job_id AS jobId, entity, entity_id AS entityId
       FROM sync_changes FORCE INDEX (sync_changes_job_seq)
      WHERE job_id IN (?) AND shop_id = ? AND seq > ? ORDER BY seq LIMIT ${CHANGE_PAGE}`,
    [jobIds, shopId, since],
  );
}
