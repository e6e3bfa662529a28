// The shop's gauges with their resolution, expanded uncertainty and calibration dates.
import { DataTypes } from "sequelize";
import { TABLE_OPTIONS, bool, decimal, fk, intId, timestamps, varchar, type MigrationParams } from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "instruments",
    {
      id: intId(),
      shop_id: fk("shops", "RESTRICT"),
      kind: varchar(32),
      label: varchar(120),
      serial: varchar(64),
      unit: varchar(8),
      resolution: decimal(12, 6, false),
      // Expanded uncertainty U in `unit`, at coverage factor coverage_k (normally k = 2).
      expanded_u: decimal(12, 6, false),
      coverage_k: { type: DataTypes.DECIMAL(4, 2), allowNull: false, defaultValue: 2 },
      calibrated_on: { type: DataTypes.DATEONLY, allowNull: true },
      calibration_due: { type: DataTypes.DATEONLY, allowNull: true },
      // Most dial bore gauges read plus when the bore is smaller than the setting size.
      dial_plus_means_smaller: bool(true),
      active: bool(true),
      certificate_attachment_id: fk("attachments", "SET NULL", { type: DataTypes.CHAR(36) }),
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("instruments", ["shop_id", "serial"], { name: "instruments_shop_serial_unique", unique: true });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable("instruments");
}
