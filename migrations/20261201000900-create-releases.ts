// An inspector's signed release of a job. Voiding (on reopen) marks the row; it is never deleted.
import { DataTypes } from "sequelize";
import { TABLE_OPTIONS, fk, intId, timestamps, varchar, type MigrationParams } from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "releases",
    {
      id: intId(),
      shop_id: fk("shops", "RESTRICT"),
      job_id: fk("jobs", "RESTRICT"),
      inspector_id: fk("users", "RESTRICT"),
      signed_name: varchar(160),
      signed_at: { type: DataTypes.DATE(3), allowNull: false },
      checklist: { type: DataTypes.JSON, allowNull: false },
      // SHA-256 (hex) over the canonical serialisation, version canonical_version, of the record.
      hash: { type: DataTypes.CHAR(64), allowNull: false },
      canonical_version: { type: DataTypes.INTEGER, allowNull: false },
      voided_at: { type: DataTypes.DATE(3), allowNull: true },
      voided_by: fk("users", "RESTRICT", { allowNull: true }),
      void_reason: { type: DataTypes.TEXT, allowNull: true },
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("releases", ["job_id", "signed_at"], { name: "releases_job_signed" });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable("releases");
}
