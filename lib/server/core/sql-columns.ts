import "server-only";
import { utcDate } from "@/lib/server/core/sql-driver";

// A model's columns read through the driver (sql-read.ts) as the plain object Sequelize would give:
// the SELECT list names each column by its attribute (`j.unit_system AS unitSystem`), and `read`
// turns the driver's values into the attribute's own (DATETIME text → Date, TINYINT(1) → boolean,
// JSON text → its value; DECIMAL and BIGINT already arrive as numbers). The caller (a feature's
// repo.ts, the only importer of models/) passes the model's getAttributes().

type Attribute = { field?: string; type?: unknown };
const kindOf = (a: Attribute) => String((a.type as { key?: string } | undefined)?.key ?? "");

function convert(kind: string, v: unknown): unknown {
  if (v === null || v === undefined) return null;
  if (kind === "DATE") return utcDate(v);
  if (kind === "BOOLEAN") return Boolean(Number(v));
  if (kind === "JSON") return typeof v === "string" ? JSON.parse(v) : v;
  if (kind === "DECIMAL" || kind === "BIGINT") return Number(v);
  return v;
}

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
    kind: kindOf(a),
  }));
  return {
    list: columns.map((c) => `${alias}.\`${c.field}\` AS \`${c.key}\``).join(", "),
    read(row) {
      const out: Record<string, unknown> = {};
      for (const c of columns) out[c.name] = convert(c.kind, row[c.key]);
      return out as T;
    },
  };
}
