// The change feed behind GET /api/sync?since=CURSOR: the cursor is the last id a device has seen.
import { DataTypes } from "sequelize";
import { TABLE_OPTIONS, bigId, createdAt, enumOf, fk, varchar, type MigrationParams } from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "sync_changes",
    {
      id: bigId(),
      shop_id: fk("shops", "RESTRICT"),
      job_id: fk("jobs", "CASCADE"),
      entity: enumOf(["reading", "flag", "job_limits", "job"]),
      entity_id: { type: DataTypes.STRING(64), allowNull: false },
      // The device whose upload caused the change, so it can skip its own echo; null for office edits.
      device_id: varchar(64, true),
      created_at: createdAt(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("sync_changes", ["job_id", "id"], { name: "sync_changes_job_id" });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable("sync_changes");
}
