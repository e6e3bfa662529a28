// Attribute shorthands for the model classes. Whether the mariadb driver returns a DECIMAL as a
// string ("4.030000") or a number depends on connection options (decimalAsNumber,
// supportBigNumbers, bigNumberStrings); the getter made here makes it `number` (or null) either
// way, and also for a value that was set as a string, so repos and lib/domain see numbers only.
import { DataTypes, type Model, type ModelAttributeColumnOptions, type Sequelize } from "sequelize";

type Column = ModelAttributeColumnOptions;

/** A DECIMAL read back as a number (or null). `name` is the attribute's own name. */
export function decimal(name: string, precision: number, scale: number, allowNull = true): Column {
  return {
    type: DataTypes.DECIMAL(precision, scale),
    allowNull,
    get(this: Model): number | null {
      return decimalToNumber(this.getDataValue(name));
    },
  };
}

export function decimalToNumber(raw: unknown): number | null {
  if (raw === null || raw === undefined) return null;
  return typeof raw === "number" ? raw : Number(raw);
}

/**
 * A BIGINT id read back as a number. The driver may hand BIGINTs back as BigInt, which
 * JSON.stringify rejects; these ids stay far below 2^53.
 */
export function bigId(name: string): Column {
  return {
    type: DataTypes.BIGINT,
    primaryKey: true,
    autoIncrement: true,
    get(this: Model): number {
      return Number(this.getDataValue(name));
    },
  };
}

export function intId(): Column {
  return { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true };
}

export function uuidId(): Column {
  return { type: DataTypes.CHAR(36), primaryKey: true, allowNull: false };
}

export function ref(allowNull = false, type: Column["type"] = DataTypes.INTEGER): Column {
  return { type, allowNull };
}

export function str(length: number, allowNull = false): Column {
  return { type: DataTypes.STRING(length), allowNull };
}

export function text(): Column {
  return { type: DataTypes.TEXT, allowNull: true };
}

export function enumOf(values: readonly string[], allowNull = false, defaultValue?: string): Column {
  const column: Column = { type: DataTypes.ENUM(...values), allowNull };
  if (defaultValue !== undefined) column.defaultValue = defaultValue;
  return column;
}

export function bool(defaultValue: boolean): Column {
  return { type: DataTypes.BOOLEAN, allowNull: false, defaultValue };
}

export function int(defaultValue?: number): Column {
  const column: Column = { type: DataTypes.INTEGER, allowNull: false };
  if (defaultValue !== undefined) column.defaultValue = defaultValue;
  return column;
}

export function datetime(allowNull: boolean, defaultNow = false): Column {
  const column: Column = { type: DataTypes.DATE(3), allowNull };
  if (defaultNow) column.defaultValue = DataTypes.NOW;
  return column;
}

export function dateOnly(): Column {
  return { type: DataTypes.DATEONLY, allowNull: true };
}

export function json(allowNull: boolean): Column {
  return { type: DataTypes.JSON, allowNull };
}

/**
 * Options every model shares: snake_case columns for camelCase attributes, an explicit table
 * name, and created_at/updated_at when `stamps` asks for them.
 */
export function modelOptions(sequelize: Sequelize, tableName: string, stamps: "both" | "created" | "none") {
  return {
    sequelize,
    tableName,
    underscored: true,
    timestamps: stamps !== "none",
    ...(stamps === "both" ? {} : { updatedAt: false as const }),
  };
}

/** The timestamp attributes, declared so `init` sees every attribute of the class. */
export function stamps(): { createdAt: Column; updatedAt: Column } {
  return { createdAt: datetime(false), updatedAt: datetime(false) };
}
