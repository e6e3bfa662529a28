import "server-only";
import { QueryTypes, type Transaction } from "sequelize";
import { getSequelize } from "./db";

// One multi-row INSERT with bound parameters: the mariadb driver formats the values itself, which
// is several times cheaper than Sequelize's own escaping of replacements for hundreds of rows
// (bench:sync). Dates go as Date objects (UTC, as the connection is configured); never undefined.

/** Inserts `rows` (values in `columns` order); returns the first auto-increment id, if the table has one. */
export async function insertMany(t: Transaction, table: string, columns: readonly string[], rows: unknown[][]): Promise<number> {
  if (rows.length === 0) return 0;
  const bind: unknown[] = [];
  const tuples = rows.map((row) => {
    const marks = row.map((v) => {
      bind.push(v === undefined ? null : v);
      return `$${bind.length}`;
    });
    return `(${marks.join(",")})`;
  });
  const [firstId] = await getSequelize().query(
    `INSERT INTO ${table} (${columns.map((c) => `\`${c}\``).join(",")}) VALUES ${tuples.join(",")}`,
    { bind, type: QueryTypes.INSERT, transaction: t },
  );
  return Number(firstId);
}
