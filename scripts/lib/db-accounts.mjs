// The local MariaDB's two accounts (see lib/server/core/db-rights.ts): the schema owner, for
// migrations and seeding, and the app's account with only its table rights.
import { execFileSync } from "node:child_process";

export const OWNER_USER = "tenthwise_owner";
export const APP_USER = "tenthwise";
const HOST = "127.0.0.1";

/** The root statements creating both accounts, printed by `npm run db:grants` (one source). */
export function accountStatements({ databases, ownerPassword, appPassword }) {
  const [database, ...extra] = databases;
  const args = ["--accounts-only", "--host", HOST, "--owner-user", OWNER_USER, "--app-user", APP_USER];
  const out = execFileSync(
    "node",
    [
      "node_modules/tsx/dist/cli.mjs",
      "scripts/db-grants.ts",
      ...args,
      "--database",
      database,
      ...extra.flatMap((d) => ["--extra-database", d]),
    ],
    { encoding: "utf8", env: { ...process.env, DB_PASSWORD: appPassword, DB_OWNER_PASSWORD: ownerPassword } },
  );
  return out.split("\n").filter((l) => l.trim() && !l.startsWith("--"));
}

/** The app's environment for both accounts on the local server. */
export function accountsEnv(db, database, { ownerPassword, appPassword }) {
  return {
    DATABASE_URL: db.urlFor(database, { user: APP_USER, password: appPassword }),
    DB_OWNER_USER: OWNER_USER,
    DB_OWNER_PASSWORD: ownerPassword,
  };
}

/** The environment of a process that runs as the app (the web server): no owner's account in it. */
export function withoutOwnerAccount(env) {
  const copy = { ...env };
  delete copy.DB_OWNER_USER;
  delete copy.DB_OWNER_PASSWORD;
  return copy;
}
