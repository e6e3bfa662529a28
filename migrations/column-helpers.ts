// Column shorthands shared by the migrations. Migrations are history: once a migration has shipped,
// changing a helper here would silently change what it creates. Add a new helper instead of
// editing one that a shipped migration uses.
import { DataTypes, Sequelize, type ModelAttributeColumnOptions, type QueryInterface } from "sequelize";

export type MigrationParams = { context: QueryInterface };

type Column = ModelAttributeColumnOptions;
type OnDelete = "RESTRICT" | "CASCADE" | "SET NULL";

/** Every table is utf8mb4 so names, notes and e-mail addresses hold any character. */
export const TABLE_OPTIONS = { charset: "utf8mb4", collate: "utf8mb4_unicode_ci", engine: "InnoDB" };

export function intId(): Column {
  return { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true, allowNull: false };
}

export function bigId(): Column {
  return { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true, allowNull: false };
}

/** Client-generated UUID primary key: no default, so a resent record keeps its identity. */
export function uuidId(): Column {
  return { type: DataTypes.CHAR(36), primaryKey: true, allowNull: false };
}

/**
 * Millisecond timestamps. The database default lets raw INSERTs (bulk loads, benchmarks) omit them;
 * Sequelize fills them itself on model writes.
 */
export function createdAt(): Column {
  return { type: DataTypes.DATE(3), allowNull: false, defaultValue: Sequelize.literal("CURRENT_TIMESTAMP(3)") };
}

export function timestamps(): { created_at: Column; updated_at: Column } {
  return { created_at: createdAt(), updated_at: createdAt() };
}

/** A foreign key to `table`.id; `type` must match the referenced primary key exactly. */
export function fk(
  table: string,
  onDelete: OnDelete,
  opts: { allowNull?: boolean; type?: Column["type"] } = {},
): Column {
  const allowNull = opts.allowNull ?? onDelete === "SET NULL";
  return {
    type: opts.type ?? DataTypes.INTEGER,
    allowNull,
    references: { model: table, key: "id" },
    onDelete,
  };
}

export function decimal(precision: number, scale: number, allowNull = true): Column {
  return { type: DataTypes.DECIMAL(precision, scale), allowNull };
}

export function varchar(length: number, allowNull = false): Column {
  return { type: DataTypes.STRING(length), allowNull };
}

export function enumOf(values: readonly string[], defaultValue?: string, allowNull = false): Column {
  const column: Column = { type: DataTypes.ENUM(...values), allowNull };
  if (defaultValue !== undefined) column.defaultValue = defaultValue;
  return column;
}

export function bool(defaultValue: boolean): Column {
  return { type: DataTypes.BOOLEAN, allowNull: false, defaultValue };
}

export const UNIT_SYSTEMS = ["in", "mm"] as const;
export const VERDICTS = ["in_spec", "marginal", "out_of_spec"] as const;
export const DISPOSITIONS = ["measure_again", "machine_again", "accept"] as const;

/**
 * The columns of one spec limit, shared by a template's limits (spec_limits) and a job's frozen
 * copy of them (job_limits). Values are in `unit`; per_inch_* are per inch (or per mm) of diameter.
 */
export function limitColumns(): Record<string, Column> {
  return {
    characteristic: varchar(48),
    station_pattern: varchar(64),
    limit_type: enumOf(["min_max", "nominal_tol", "max_only", "min_only", "per_inch", "iso286"]),
    unit: varchar(8),
    min: decimal(14, 6),
    max: decimal(14, 6),
    nominal: decimal(14, 6),
    tol_plus: decimal(14, 6),
    tol_minus: decimal(14, 6),
    per_inch_min: decimal(14, 6),
    per_inch_max: decimal(14, 6),
    iso_class: varchar(8, true),
    required: bool(true),
    gauge_kind: varchar(32, true),
    label: varchar(120, true),
    sort_order: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  };
}
