import "server-only";
import mariadb, { type Connection } from "mariadb";
import type { DbConfig } from "./database";

// What a database holds, asked through the account given (the owner's for backups), with raw SQL
// on information_schema and the migrations ledger: no model is involved, so a restore can check a
// database of any migration level.

const LEDGER = "schema_migrations";

async function withConnection<T>(db: DbConfig, run: (c: Connection) => Promise<T>): Promise<T> {
  const conn = await mariadb.createConnection({
    host: db.host,
    port: db.port,
    user: db.username,
    password: db.password,
    database: db.database,
    connectTimeout: 10_000,
  });
  try {
    return await run(conn);
  } finally {
    await conn.end();
  }
}

const ident = (name: string) => `\`${name.replace(/`/g, "``")}\``;

async function tableNames(c: Connection, db: DbConfig, type = "BASE TABLE"): Promise<string[]> {
  const rows: { name: string }[] = await c.query(
    "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = ? AND table_type = ? ORDER BY 1",
    [db.database, type],
  );
  return rows.map((r) => r.name);
}

/** The migrations applied, in order (none when the ledger does not exist yet). */
export function migrationsApplied(db: DbConfig): Promise<string[]> {
  return withConnection(db, async (c) => {
    if (!(await tableNames(c, db)).includes(LEDGER)) return [];
    const rows: { name: string }[] = await c.query(`SELECT name FROM ${LEDGER} ORDER BY name`);
    return rows.map((r) => r.name);
  });
}

/**
 * The tables holding rows. A database that only ran its migrations (rows in the ledger alone) counts
 * as empty: `npm run db:setup` on a new server leaves it so, and a restore replaces it whole.
 */
export function tablesWithRows(db: DbConfig): Promise<string[]> {
  return withConnection(db, async (c) => {
    const found: string[] = [];
    for (const t of await tableNames(c, db)) {
      if (t === LEDGER) continue;
      const [row]: { any: number }[] = await c.query(`SELECT EXISTS(SELECT 1 FROM ${ident(t)}) AS \`any\``);
      if (Number(row.any)) found.push(t);
    }
    return found;
  });
}

/** Drops every table, view and routine of the database, so the dump is loaded into nothing. */
export function emptyDatabase(db: DbConfig): Promise<void> {
  return withConnection(db, async (c) => {
    await c.query("SET FOREIGN_KEY_CHECKS = 0");
    for (const v of await tableNames(c, db, "VIEW")) await c.query(`DROP VIEW ${ident(v)}`);
    for (const t of await tableNames(c, db)) await c.query(`DROP TABLE ${ident(t)}`);
    const routines: { name: string; type: string }[] = await c.query(
      "SELECT routine_name AS name, routine_type AS type FROM information_schema.routines WHERE routine_schema = ?",
      [db.database],
    );
    for (const r of routines)
      await c.query(`DROP ${r.type === "FUNCTION" ? "FUNCTION" : "PROCEDURE"} ${ident(r.name)}`);
  });
}

export type RowCounts = Record<string, number>;

/** Rows per table, for the summary a restore prints. */
export function rowCounts(db: DbConfig, tables: string[]): Promise<RowCounts> {
  return withConnection(db, async (c) => {
    const present = new Set(await tableNames(c, db));
    const counts: RowCounts = {};
    for (const t of tables.filter((name) => present.has(name))) {
      const [row]: { n: number | bigint }[] = await c.query(`SELECT COUNT(*) AS n FROM ${ident(t)}`);
      counts[t] = Number(row.n);
    }
    return counts;
  });
}

/** Every object key the attachments table names (photos, their previews, certificates). */
export function attachmentKeys(db: DbConfig): Promise<string[]> {
  return withConnection(db, async (c) => {
    if (!(await tableNames(c, db)).includes("attachments")) return [];
    const rows: { k: string | null; t: string | null }[] = await c.query(
      "SELECT object_key AS k, thumb_key AS t FROM attachments",
    );
    return rows.flatMap((r) => [r.k, r.t]).filter((k): k is string => !!k);
  });
}
