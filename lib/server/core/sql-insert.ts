import "server-only";
import type { Transaction } from "sequelize";
import { sqlWrite } from "@/lib/server/core/sql-driver";

// One multi-row INSERT with `?` placeholders on the transaction's own driver connection
// (sql-driver.ts): the mariadb driver formats the values itself, which is several times cheaper
// than Sequelize's handling of hundreds of bound values (bench:sync). Dates go as UTC text;
// undefined as NULL.

/** The SQL of a multi-row INSERT of `count` rows. */
export function insertSql(table: string, columns: readonly string[], count: number): string {
  const tuple = `(${columns.map(() => "?").join(",")})`;
  return `INSERT INTO ${table} (${columns.map((c) => `\`${c}\``).join(",")}) VALUES ${Array(count).fill(tuple).join(",")}`;
}

/** Inserts `rows` (values in `columns` order); returns the first auto-increment id, if the table has one. */
export async function insertMany(
  t: Transaction,
  table: string,
  columns: readonly string[],
  rows: unknown[][],
): Promise<number> {
  if (rows.length === 0) return 0;
  const { insertId } = await sqlWrite(t, insertSql(table, columns, rows.length), rows.flat());
  return insertId;
}
