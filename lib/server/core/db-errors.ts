import "server-only";
import { READING_COLUMNS } from "@/lib/schemas/readings";

// What a database failure means to the person who sent the request. Two kinds matter:
// - a constraint the input broke (a text too long for its column, a figure out of its DECIMAL's range,
//   characters the column cannot keep, a JSON column's validity check, a missing parent row): the
//   schemas should have refused it first, so this is the last line; it answers 422 naming the field.
// - an outage (the database refused or dropped the connection, the pool found none in time, a Galera
//   node not yet ready): nothing the sender did wrong; it answers 503 and the sender tries again.
// Lock waits and deadlocks are neither: the transaction retries them (ingest-retry.ts), and one that
// still fails after its retries is a fault of the server, not an outage of the database.

export type DbFailure =
  | { kind: "outage"; errno?: number; code?: string; reason: string }
  | { kind: "constraint"; errno?: number; table?: string; column?: string; field: string; words: string };

type DriverError = { errno?: number; code?: string; sqlMessage?: string; message?: string; sql?: string };

/** The table an INSERT or UPDATE writes, for messages that name only the column ("at row 1"). */
const WRITTEN_TABLE = /^\s*(?:INSERT\s+(?:IGNORE\s+)?INTO|REPLACE\s+INTO|UPDATE)\s+`?(\w+)`?/i;

// MariaDB server errnos (and the mariadb driver's own, 45xxx) that mean "no usable connection".
const OUTAGE_ERRNOS = new Set([
  1040, // too many connections
  1047, // WSREP has not yet prepared node for application use (Galera)
  1053, // server shutdown in progress
  1927, // connection was killed
  2002, // can't connect through socket
  2003, // can't connect to server
  2006, // server has gone away
  2013, // lost connection during query
  4031, // disconnected by the server for inactivity
  45001, // connection already closed
  45009, // socket closed unexpectedly
  45012, // connection timeout
  45027, // pool already closed
  45028, // pool: no connection in time
  45035, // connection added to a closed pool
  45037, // pool closing
  45060, // pool not initialised
  45061, // pool has no connection
]);
const OUTAGE_CODES = new Set(["ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "EPIPE", "EHOSTUNREACH", "ENOTFOUND"]);
// Sequelize's own connection errors (its pool's acquire timeout among them); access denied is a
// configuration mistake, not an outage, so it stays a 500 that someone must look at.
const OUTAGE_NAMES = new Set([
  "SequelizeConnectionError",
  "SequelizeConnectionRefusedError",
  "SequelizeHostNotFoundError",
  "SequelizeHostNotReachableError",
  "SequelizeConnectionTimedOutError",
  "SequelizeConnectionAcquireTimeoutError",
  "SequelizeInvalidConnectionError",
]);

/** The words for each constraint errno; the field's name goes in front in the envelope. */
const CONSTRAINT_WORDS: Record<number, string> = {
  1048: "This is needed; fill it in",
  1364: "This is needed; fill it in",
  1062: "This is already in use; choose another",
  1264: "This figure is outside the range the database keeps; check it",
  1690: "This figure is outside the range the database keeps; check it",
  1265: "This holds more than the database keeps (too many decimal places, or not one of the choices); check it",
  1292: "This is not a date or figure the database can keep; check it",
  1366: "This holds characters the database cannot keep (control characters or broken symbols); remove them",
  1367: "This figure is not one the database can keep; check it",
  1300: "This holds characters the database cannot keep (control characters or broken symbols); remove them",
  1406: "This is too long for the database; shorten it",
  1451: "Other records still refer to this one; remove those first",
  1452: "This names a record that does not exist; pick one from the list",
  4025: "This holds text the database cannot keep (control characters or broken symbols); remove them",
};

// Columns whose API field is not simply the column in camelCase.
const FIELD_OF_COLUMN: Record<string, Record<string, string>> = {
  readings: Object.fromEntries(Object.entries(READING_COLUMNS).map(([field, column]) => [column, field])),
};
// Columns no request field maps to one-to-one (what the audit trail keeps is built from many fields).
const UNNAMED_TABLES = new Set(["audit_events", "sync_changes", "mail_outbox"]);

const camel = (column: string) => column.replace(/_([a-z0-9])/g, (_, c: string) => c.toUpperCase());

/** The API field a column holds, or "_" (the whole request) when no one field does. */
export function fieldOfColumn(table: string | undefined, column: string | undefined): string {
  if (!column || (table && UNNAMED_TABLES.has(table))) return "_";
  return (table && FIELD_OF_COLUMN[table]?.[column]) ?? camel(column);
}

/** The error itself and what it wraps (Sequelize keeps the driver's error as `parent`/`original`). */
function chain(err: unknown): DriverError[] {
  const out: DriverError[] = [];
  let e = err as (DriverError & { parent?: unknown; original?: unknown; cause?: unknown }) | null | undefined;
  for (let depth = 0; e && typeof e === "object" && depth < 4; depth++) {
    out.push(e);
    e = (e.parent ?? e.original ?? e.cause) as typeof e;
  }
  return out;
}

const unquote = (s: string) => s.replace(/[`'"]/g, "");

/** Table and column named by a MariaDB message ("for column `db`.`t`.`c`", "for column 'c'", "Column 'c'"). */
export function columnInMessage(message: string): { table?: string; column?: string } {
  const dotted = /for column ([`'"][^`'"]+[`'"])\.([`'"][^`'"]+[`'"])\.([`'"][^`'"]+[`'"])/.exec(message);
  if (dotted) return { table: unquote(dotted[2]), column: unquote(dotted[3]) };
  const plain = /(?:for column|Column) [`'"]([^`'"]+)[`'"]/.exec(message);
  if (plain) return { column: plain[1] };
  // CHECK failures name the constraint, and a column's own check (JSON_VALID) is named after it.
  const check = /CONSTRAINT [`'"]([^`'"]+)[`'"] failed for [`'"][^`'"]+[`'"]\.[`'"]([^`'"]+)[`'"]/.exec(message);
  // MariaDB names a column's own check "<table>.<column>" (JSON columns' JSON_VALID among them).
  if (check) return { table: check[2], column: check[1].split(".").pop() };
  const fk = /\(`[^`]+`\.`([^`]+)`, CONSTRAINT `[^`]+` FOREIGN KEY \(`([^`]+)`/.exec(message);
  if (fk) return { table: fk[1], column: fk[2] };
  return {};
}

/** Sorts a thrown error into an outage, a broken constraint, or null (something else). */
export function classifyDbError(err: unknown, table?: string): DbFailure | null {
  const links = chain(err);
  for (const e of links) {
    const name = (e as { name?: string }).name;
    if ((name && OUTAGE_NAMES.has(name)) || (e.errno && OUTAGE_ERRNOS.has(e.errno)) || OUTAGE_CODES.has(e.code ?? ""))
      return { kind: "outage", errno: e.errno, code: e.code ?? name, reason: e.message ?? "" };
  }
  const validation = links[0] as { name?: string; errors?: { path?: string | null; message?: string }[] };
  const driver = links.find((e) => typeof e.errno === "number");
  if (driver?.errno && CONSTRAINT_WORDS[driver.errno]) {
    const text = driver.sqlMessage ?? driver.message ?? "";
    const where = columnInMessage(text);
    const fkFields = (links[0] as { fields?: string[] | Record<string, unknown> }).fields;
    const column =
      where.column ?? (Array.isArray(fkFields) ? fkFields[0] : fkFields ? Object.keys(fkFields)[0] : undefined);
    const sql = links.find((e) => typeof e.sql === "string")?.sql ?? "";
    const tableName = where.table ?? table ?? WRITTEN_TABLE.exec(sql)?.[1];
    return {
      kind: "constraint",
      errno: driver.errno,
      table: tableName,
      column,
      field: fieldOfColumn(tableName, column),
      words: CONSTRAINT_WORDS[driver.errno],
    };
  }
  // Sequelize's own model checks (allowNull, length validators) name the model attribute already.
  if (validation?.name === "SequelizeValidationError" && validation.errors?.length) {
    const item = validation.errors[0];
    return { kind: "constraint", field: item.path ?? "_", words: item.message ?? "This value is not accepted" };
  }
  return null;
}
