import "server-only";
import { getSequelize } from "@/lib/server/core/db";
import { queryOn, streamOn, type DriverConnection, type RowShape, type RowStream } from "@/lib/server/core/sql-driver";

// Office reads straight on the mariadb driver, outside any transaction: a pooled connection of the
// shared Sequelize instance, the same options as sql-driver.ts (plain row objects, DECIMAL and BIGINT
// as numbers, DATETIME as UTC text). Turning rows into Sequelize instances, or even Sequelize's raw
// rows with its query building and per-field type casting, costs more CPU than a page's queries.
// The SQL stays in each feature's repo.ts.
//
// Queries issued together inside `withReads` are pipelined on the one connection (the server runs
// them in turn, without a round trip between them); await them together with settleAll.

/** Runs one SELECT and gives its rows as plain objects (or, asked, as arrays of cells). */
export type Read = <R = Record<string, unknown>>(sql: string, values?: unknown[], shape?: RowShape) => Promise<R[]>;
/** Runs one SELECT whose rows are handed over one at a time (sql-driver.ts's streamOn). */
export type Stream = <R = Record<string, unknown>>(sql: string, values?: unknown[], shape?: RowShape) => RowStream<R>;

type Pool = {
  getConnection(o: { type: "read" }): Promise<DriverConnection>;
  releaseConnection(c: DriverConnection): void;
};

const poolOf = () => (getSequelize() as unknown as { connectionManager: Pool }).connectionManager;

/** Lends `fn` a pooled connection for its reads and gives it back once `fn` has settled. */
export async function withReads<T>(fn: (read: Read, stream: Stream) => Promise<T>): Promise<T> {
  const pool = poolOf();
  const connection = await pool.getConnection({ type: "read" });
  const read: Read = async <R>(sql: string, values: unknown[] = [], shape?: RowShape) => {
    const rows = (await queryOn(connection, sql, values, shape)) as R[];
    return Array.isArray(rows) ? rows : [];
  };
  const stream: Stream = <R>(sql: string, values: unknown[] = [], shape?: RowShape) =>
    streamOn<R>(connection, sql, values, shape);
  try {
    return await fn(read, stream);
  } finally {
    pool.releaseConnection(connection);
  }
}

/** One SELECT outside any transaction, its rows as plain objects (or, asked, as arrays of cells). */
export const readRows = <R = Record<string, unknown>>(
  sql: string,
  values: unknown[] = [],
  shape?: RowShape,
): Promise<R[]> => withReads((read) => read<R>(sql, values, shape));
