// The audit trail. Append-only, enforced in the database: triggers refuse every UPDATE and
// DELETE, whoever connects. (FK actions do not fire triggers, so its foreign keys are RESTRICT.)
import { DataTypes } from "sequelize";
import { TABLE_OPTIONS, bigId, createdAt, fk, varchar, type MigrationParams } from "./column-helpers";

const TRIGGERS = [
  { name: "audit_events_no_update", event: "UPDATE" },
  { name: "audit_events_no_delete", event: "DELETE" },
] as const;

export const APPEND_ONLY_MESSAGE = "audit_events is append-only";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "audit_events",
    {
      id: bigId(),
      shop_id: fk("shops", "RESTRICT"),
      user_id: fk("users", "RESTRICT", { allowNull: true }), // null for system actions
      action: varchar(64), // e.g. 'reading.create', 'flag.dispose', 'release.void'
      entity_type: varchar(32),
      entity_id: varchar(64),
      before: { type: DataTypes.JSON, allowNull: true },
      after: { type: DataTypes.JSON, allowNull: true },
      created_at: createdAt(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("audit_events", ["shop_id", "created_at"], { name: "audit_events_shop_created" });
  await qi.addIndex("audit_events", ["entity_type", "entity_id"], { name: "audit_events_entity" });

  for (const t of TRIGGERS) {
    await qi.sequelize.query(
      `CREATE TRIGGER ${t.name} BEFORE ${t.event} ON audit_events FOR EACH ROW ` +
        `SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = '${APPEND_ONLY_MESSAGE}'`,
    );
  }
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  for (const t of TRIGGERS) await qi.sequelize.query(`DROP TRIGGER IF EXISTS ${t.name}`);
  await qi.dropTable("audit_events");
}
