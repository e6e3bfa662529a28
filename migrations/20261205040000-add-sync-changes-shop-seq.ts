// The notifier follows each shop's change feed by its sequence (sync_changes.seq, numbered in
// commit order, 20261204020000) instead of the global id: it reads the changes of a shop between
// two sequence numbers, which this index serves directly. It takes the place of the plain shop_id
// index MariaDB made for the foreign key (the key can use this one), so an insert still maintains
// the same number of indexes.
import { QueryTypes } from "sequelize";
import type { MigrationParams } from "./column-helpers";

const NAME = "sync_changes_shop_seq";
// Made by 20261201001100 and 20261204020000; either one serves the job_id foreign key alone.
const JOB_INDEXES: [string, string[]][] = [
  ["sync_changes_job_id", ["job_id", "id"]],
  ["sync_changes_job_seq", ["job_id", "seq"]],
];

/** The names of the indexes on sync_changes made of shop_id alone. */
async function shopOnlyIndexes(qi: MigrationParams["context"]): Promise<string[]> {
  const rows = await qi.sequelize.query<{ name: string }>(
    `SELECT INDEX_NAME AS name FROM information_schema.STATISTICS
      WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'sync_changes'
      GROUP BY INDEX_NAME HAVING COUNT(*) = 1 AND MAX(COLUMN_NAME) = 'shop_id'`,
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.name);
}

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.addIndex("sync_changes", ["shop_id", "seq"], { name: NAME });
  for (const name of await shopOnlyIndexes(qi)) await qi.removeIndex("sync_changes", name);
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  // The foreign key needs an index on shop_id first: the plain one again, then ours can go. The
  // job indexes are made again after it, so the table is as it was, its indexes in their order.
  await qi.addIndex("sync_changes", ["shop_id"], { name: "shop_id" });
  for (const [name, columns] of JOB_INDEXES) {
    await qi.removeIndex("sync_changes", name);
    await qi.addIndex("sync_changes", columns, { name });
  }
  await qi.removeIndex("sync_changes", NAME);
}
