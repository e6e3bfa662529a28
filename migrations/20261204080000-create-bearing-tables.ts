// Bearing shell selection: the shells on the shelf for a job, each bearing point's housing bore
// and saved choice of halves, and the factory grade tables a shop keeps. Figures are in the
// row's unit (in or mm), DECIMAL(10,6) so a ten-thousandth of an inch and a micron both stay exact.
import { DataTypes } from "sequelize";
import {
  TABLE_OPTIONS,
  bool,
  decimal,
  enumOf,
  fk,
  intId,
  timestamps,
  varchar,
  type MigrationParams,
} from "./column-helpers";

// As lib/schemas/bearings.ts had them when this shipped (a migration is history: no import).
const ROLES = ["main", "thrust", "rod"];
const STEPS = ["standard", "thicker", "thinner", "undersize", "graded"];
const WALL_SOURCES = ["nominal", "range", "measured"];
const UNITS = ["in", "mm"];

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "bearing_shells",
    {
      id: intId(),
      shop_id: fk("shops", "CASCADE"),
      job_id: fk("jobs", "CASCADE"),
      series: varchar(80),
      role: enumOf(ROLES),
      step: enumOf(STEPS),
      step_amount: decimal(10, 6),
      grade: varchar(24, true),
      // No walls on a thicker, thinner or undersize set: the core derives them from the series' standard set.
      wall_source: enumOf(WALL_SOURCES, undefined, true),
      wall: decimal(10, 6),
      wall_min: decimal(10, 6),
      wall_max: decimal(10, 6),
      wall_upper: decimal(10, 6),
      wall_lower: decimal(10, 6),
      wall_gauge_id: fk("instruments", "SET NULL"),
      halves_upper: { type: DataTypes.INTEGER, allowNull: false },
      halves_lower: { type: DataTypes.INTEGER, allowNull: false },
      unit: enumOf(UNITS),
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("bearing_shells", ["job_id"], { name: "bearing_shells_job" });
  await qi.createTable(
    "bearing_points",
    {
      id: intId(),
      shop_id: fk("shops", "CASCADE"),
      job_id: fk("jobs", "CASCADE"),
      // "main/3" or "rod/5": a main bearing or a rod's big end.
      point: varchar(16),
      housing_bore: decimal(10, 6),
      housing_gauge_id: fk("instruments", "SET NULL"),
      // The main that takes the thrust shells (its own series, often another width).
      thrust: bool(false),
      housing_code: varchar(16, true),
      journal_code: varchar(16, true),
      upper_shell_id: fk("bearing_shells", "RESTRICT", { allowNull: true }),
      lower_shell_id: fk("bearing_shells", "RESTRICT", { allowNull: true }),
      predicted_clearance: decimal(10, 6),
      predicted_u: decimal(10, 6),
      by_hand: bool(false),
      chosen_by: fk("users", "SET NULL"),
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("bearing_points", ["job_id", "point"], { name: "bearing_points_job_point", unique: true });
  await qi.createTable(
    "bearing_grade_tables",
    {
      id: intId(),
      shop_id: fk("shops", "CASCADE"),
      name: varchar(120),
      document: { type: DataTypes.JSON, allowNull: false },
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("bearing_grade_tables", ["shop_id", "name"], { name: "bearing_grade_tables_name", unique: true });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable("bearing_grade_tables");
  await qi.dropTable("bearing_points");
  await qi.dropTable("bearing_shells");
}
