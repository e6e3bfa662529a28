import type { MIGRATED_TABLES } from "@/migrations";

// Not "server-only": db-setup, `npm run db:grants`, npm start and the test harness run this outside
// Next. The one statement of what each database account may do, so the README's statements, the
// local MariaDB of npm start and npm test, and the grants db-setup applies after migrating agree.
//
// Two accounts: the OWNER runs migrations and seeding (all rights on the schema, including granting
// them); the APP runs the web server with only the table rights below: no DDL, no TRIGGER, no
// DROP or ALTER, no DELETE where nothing of the app deletes. audit_events is INSERT and SELECT
// only, so the app cannot rewrite history even before the table's triggers are asked.

/** A table right, or UPDATE of named columns only ("UPDATE (verdict, deviation)"). */
export type TableRight = "SELECT" | "INSERT" | "UPDATE" | "DELETE" | `UPDATE (${string})`;
type MigratedTable = (typeof MIGRATED_TABLES)[number];

const updateOf = (...columns: string[]): TableRight => `UPDATE (${columns.join(", ")})`;

/** What the app does to each table (its repos and raw SQL); a new table must say it here. */
export const APP_TABLE_RIGHTS: Record<MigratedTable, readonly TableRight[]> = {
  // Shops are started by public sign-up and `npm run shop:create`, which run as the app, and
  // activated once their e-mail is confirmed.
  shops: ["SELECT", "INSERT", "UPDATE"],
  users: ["SELECT", "INSERT", "UPDATE"],
  // The sign-in throttle counts failures and forgets them on success.
  auth_throttle: ["SELECT", "INSERT", "UPDATE", "DELETE"],
  customers: ["SELECT", "INSERT"],
  engines: ["SELECT", "INSERT", "UPDATE"],
  attachments: ["SELECT", "INSERT"],
  spec_templates: ["SELECT", "INSERT", "UPDATE"],
  // A sheet's and a job's limits are saved by replacing the set.
  spec_limits: ["SELECT", "INSERT", "DELETE"],
  jobs: ["SELECT", "INSERT", "UPDATE"],
  job_limits: ["SELECT", "INSERT", "DELETE"],
  instruments: ["SELECT", "INSERT", "UPDATE"],
  // A reading's figures never change; re-evaluation rewrites only its verdict columns.
  readings: [
    "SELECT",
    "INSERT",
    updateOf("verdict", "verdict_note", "limit_min", "limit_max", "deviation", "updated_at"),
  ],
  flags: ["SELECT", "INSERT", "UPDATE"],
  flag_dispositions: ["SELECT", "INSERT"],
  // Reopening marks the release void; what was signed never changes and is never deleted.
  releases: [
    "SELECT",
    "INSERT",
    updateOf(
      "voided_at",
      "voided_by",
      "void_reason",
      "record_key",
      "record_sha256",
      "record_bytes",
      "record_stored_at",
      "updated_at",
    ),
  ],
  audit_events: ["SELECT", "INSERT"],
  sync_changes: ["SELECT", "INSERT"],
  // Numbered by a trigger (it runs with the owner's rights); the app only reads where a shop is.
  sync_sequences: ["SELECT"],
  mail_outbox: ["SELECT", "INSERT", "UPDATE"],
  user_sessions: ["SELECT", "INSERT", "UPDATE", "DELETE"],
  // One-time links are marked used or replaced, never deleted (their hashes stay as the record).
  link_tokens: ["SELECT", "INSERT", "UPDATE"],
  // Kept progress counts (a cache the triggers mark stale): counted again and stored by the board.
  job_progress: ["SELECT", "INSERT", "UPDATE"],
  // A job's shells are entered, corrected and taken off the shelf list; a point's choice is replaced.
  bearing_shells: ["SELECT", "INSERT", "UPDATE", "DELETE"],
  bearing_points: ["SELECT", "INSERT", "UPDATE", "DELETE"],
  bearing_grade_tables: ["SELECT", "INSERT", "UPDATE", "DELETE"],
  // A gauge study is a record of what was measured: kept as taken, never changed or deleted.
  gauge_studies: ["SELECT", "INSERT"],
};

/** A MariaDB account: 'user'@'host'. */
export type DbAccount = { user: string; host: string };

const quote = (s: string) => `'${s.replace(/\\/g, "\\\\").replace(/'/g, "''")}'`;
export const ident = (s: string) => `\`${s.replace(/`/g, "``")}\``;
export const accountSql = (a: DbAccount) => `${quote(a.user)}@${quote(a.host)}`;

/** Parses CURRENT_USER()'s 'user@host' (the user part may itself hold an @). */
export function parseAccount(currentUser: string): DbAccount {
  const at = currentUser.lastIndexOf("@");
  return { user: currentUser.slice(0, at), host: currentUser.slice(at + 1) };
}

const rightSql = (r: TableRight) =>
  r.replace(/\((.+)\)$/, (_, cols: string) => `(${cols.split(", ").map(ident).join(", ")})`);

/** The app's table grants, one statement per table. */
export function appGrantStatements(database: string, app: DbAccount): string[] {
  return Object.entries(APP_TABLE_RIGHTS).map(
    ([table, rights]) =>
      `GRANT ${rights.map(rightSql).join(", ")} ON ${ident(database)}.${ident(table)} TO ${accountSql(app)};`,
  );
}

export type AccountsPlan = {
  databases: string[];
  owner: DbAccount & { password: string };
  app: DbAccount & { password: string };
};

/**
 * What an administrator (root) runs once: both accounts, the owner's rights on the schema, and the
 * app stripped of any right it held before (its table rights follow from db-setup after migrating,
 * because MariaDB grants on a table only once the table exists).
 */
export function accountStatements(plan: AccountsPlan): string[] {
  const { owner, app } = plan;
  return [
    ...plan.databases.map(
      (d) => `CREATE DATABASE IF NOT EXISTS ${ident(d)} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`,
    ),
    ...[owner, app].flatMap((a) => [
      `CREATE USER IF NOT EXISTS ${accountSql(a)} IDENTIFIED BY ${quote(a.password)};`,
      `ALTER USER ${accountSql(a)} IDENTIFIED BY ${quote(a.password)};`,
    ]),
    `REVOKE ALL PRIVILEGES, GRANT OPTION FROM ${accountSql(app)};`,
    ...plan.databases.map((d) => `GRANT ALL PRIVILEGES ON ${ident(d)}.* TO ${accountSql(owner)} WITH GRANT OPTION;`),
  ];
}
