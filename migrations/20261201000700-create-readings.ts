// Bench readings. The id is the tablet's UUID, so a resent batch upserts instead of duplicating.
// A correction is a new row that `supersedes` the old one; nothing is overwritten.
import { DataTypes } from "sequelize";
import {
  TABLE_OPTIONS,
  VERDICTS,
  bool,
  createdAt,
  decimal,
  enumOf,
  fk,
  timestamps,
  uuidId,
  varchar,
  type MigrationParams,
} from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "readings",
    {
      id: uuidId(),
      shop_id: fk("shops", "RESTRICT"),
      job_id: fk("jobs", "RESTRICT"),
      station_id: varchar(64),
      characteristic: varchar(48),
      // mm for lengths, N·m for torque. Null only for a skipped station.
      value_canonical: decimal(14, 6),
      value_entered: decimal(14, 6),
      unit_entered: varchar(8),
      entry_mode: enumOf(["direct", "dial"], "direct"),
      dial_setting: decimal(14, 6),
      dial_deviation: decimal(14, 6),
      instrument_id: fk("instruments", "RESTRICT", { allowNull: true }),
      part_temp_c: decimal(6, 2),
      lubricant: varchar(64, true),
      skipped: bool(false),
      skip_reason: varchar(255, true),
      note: varchar(500, true),
      taken_by: fk("users", "RESTRICT"),
      taken_at: { type: DataTypes.DATE(3), allowNull: false }, // the tablet's clock
      received_at: createdAt(), // the server's clock
      device_id: varchar(64),
      supersedes: fk("readings", "RESTRICT", { allowNull: true, type: DataTypes.CHAR(36) }),
      verdict: enumOf(VERDICTS, undefined, true), // null when skipped
      verdict_note: varchar(64, true),
      // The limits as evaluated, in unit_entered, and the deviation from nominal in that unit.
      limit_min: decimal(14, 6),
      limit_max: decimal(14, 6),
      deviation: decimal(14, 6),
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
  // "Flagged readings of a shop, newest first".
  await qi.addIndex("readings", ["shop_id", "verdict", "taken_at"], { name: "readings_shop_verdict_taken" });
  // "Readings of a job", by station and time.
  await qi.addIndex("readings", ["job_id", "station_id", "taken_at"], { name: "readings_job_station_taken" });
  await qi.addIndex("readings", ["supersedes"], { name: "readings_supersedes" });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable("readings");
}
