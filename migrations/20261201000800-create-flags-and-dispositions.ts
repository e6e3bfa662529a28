// Flags on out-of-spec or marginal values (raw readings or derived values) and the append-only
// history of what the lead decided about each.
import { DataTypes } from "sequelize";
import {
  DISPOSITIONS,
  TABLE_OPTIONS,
  VERDICTS,
  createdAt,
  decimal,
  enumOf,
  fk,
  intId,
  timestamps,
  varchar,
  type MigrationParams,
} from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  const readingRef = () => fk("readings", "RESTRICT", { allowNull: true, type: DataTypes.CHAR(36) });
  await qi.createTable(
    "flags",
    {
      id: intId(),
      shop_id: fk("shops", "RESTRICT"),
      job_id: fk("jobs", "RESTRICT"),
      reading_id: readingRef(), // set for a raw reading
      derived_key: varchar(96, true), // set for a derived value, e.g. 'main-oil-clearance/main/2'
      station_id: varchar(64),
      characteristic: varchar(48),
      value: decimal(14, 6, false),
      unit: varchar(8),
      limit_min: decimal(14, 6),
      limit_max: decimal(14, 6),
      deviation: decimal(14, 6),
      verdict: enumOf(VERDICTS),
      reason: enumOf(["out_of_spec", "marginal", "gauge_past_due"]),
      state: enumOf(["open", "disposed", "closed"], "open"),
      disposition: enumOf(DISPOSITIONS, undefined, true),
      operation: varchar(120, true),
      disposition_reason: { type: DataTypes.TEXT, allowNull: true },
      disposed_by: fk("users", "RESTRICT", { allowNull: true }),
      disposed_at: { type: DataTypes.DATE(3), allowNull: true },
      closed_at: { type: DataTypes.DATE(3), allowNull: true },
      closed_by_reading_id: readingRef(),
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("flags", ["shop_id", "state", "created_at"], { name: "flags_shop_state_created" });
  await qi.addIndex("flags", ["job_id", "station_id"], { name: "flags_job_station" });
  await qi.addIndex("flags", ["job_id", "derived_key"], { name: "flags_job_derived_key" });

  await qi.createTable(
    "flag_dispositions",
    {
      id: intId(),
      flag_id: fk("flags", "RESTRICT"),
      disposition: enumOf(DISPOSITIONS),
      operation: varchar(120, true),
      reason: { type: DataTypes.TEXT, allowNull: true },
      user_id: fk("users", "RESTRICT"),
      created_at: createdAt(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("flag_dispositions", ["flag_id", "created_at"], { name: "flag_dispositions_flag_created" });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable("flag_dispositions");
  await qi.dropTable("flags");
}
