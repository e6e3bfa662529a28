import "server-only";
import { utcDate } from "@/lib/server/core/sql-driver";

// A model's columns read through the driver (sql-read.ts) as the plain object Sequelize would give:
// the SELECT list names each column by its attribute (`j.unit_system AS unitSystem`), and `read`
// turns the driver's values into the attribute's own (DATETIME text → Date, TINYINT(1) → boolean,
// JSON text → its value; DECIMAL and BIGINT already arrive as numbers). The caller (a feature's
// repo.ts, the only importer of models/) passes the model's getAttributes().

type Attribute = { field?: string; type?: unknown };
const kindOf = (a: Attribute) => String((a.type as { key?: string } | undefined)?.key ?? "");

type Convert = (v: unknown) => unknown;
const asIs: Convert = (v) => v ?? null;
// Chosen once per column, not per value: a job's limits are a hundred rows of thirty columns.
const CONVERTERS: Record<string, Convert> = {
  DATE: (v) => (v === null || v === undefined ? null : utcDate(v)),
  BOOLEAN: (v) => (v === null || v === undefined ? null : Boolean(Number(v))),
  JSON: (v) => (v === null || v === undefined ? null : typeof v === "string" ? JSON.parse(v) : v),
  DECIMAL: (v) => (v === null || v === undefined ? null : Number(v)),
  BIGINT: (v) => (v === null || v === undefined ? null : Number(v)),
};

export type ModelColumns<T> = {
  /** `alias.column AS prefixattribute, …` */
  list: string;
  /** The row's values under `prefix` as the model's plain object. */
  read(row: Record<string, unknown>): T;
};

export function modelColumns<T>(attributes: Record<string, Attribute>, alias: string, prefix = ""): ModelColumns<T> {
  const columns = Object.entries(attributes).map(([name, a]) => ({
    name,
    key: `${prefix}${name}`,
    field: a.field ?? name,
    convert: CONVERTERS[kindOf(a)] ?? asIs,
  }));
  return {
    list: columns.map((c) => `${alias}.\`${c.field}\` AS \`${c.key}\``).join(", "),
    read(row) {
      const out: Record<string, unknown> = {};
      for (const c of columns) out[c.name] = c.convert(row[c.key]);
      return out as T;
    },
  };
}
