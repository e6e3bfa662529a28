// Photos and files. The owner is polymorphic (a job, a reading or an instrument), so there is no
// foreign key on owner_id; the id is client-generated so an offline photo upload can be resent.
import { DataTypes } from "sequelize";
import { TABLE_OPTIONS, createdAt, enumOf, fk, uuidId, varchar, type MigrationParams } from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "attachments",
    {
      id: uuidId(),
      shop_id: fk("shops", "RESTRICT"),
      owner_type: enumOf(["job", "reading", "instrument"]),
      owner_id: varchar(36),
      object_key: varchar(255),
      thumb_key: varchar(255, true),
      content_type: varchar(100),
      size_bytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      original_name: varchar(255),
      uploaded_by: fk("users", "RESTRICT"),
      created_at: createdAt(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("attachments", ["owner_type", "owner_id"], { name: "attachments_owner" });
  await qi.addIndex("attachments", ["object_key"], { name: "attachments_object_key_unique", unique: true });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable("attachments");
}
