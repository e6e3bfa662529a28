import { QueryTypes, type Sequelize } from "sequelize";
import { accountSql, appGrantStatements, ident, parseAccount, type DbAccount } from "@/lib/server/core/db-rights";

// Not "server-only": db-setup and `npm run db:grants` run this, connected as the schema's owner.

const NO_SUCH_GRANT = 1141; // ER_NONEXISTING_GRANT
const NO_SUCH_TABLE_GRANT = 1147; // ER_NONEXISTING_TABLE_GRANT

const errno = (err: unknown) => (err as { parent?: { errno?: number } }).parent?.errno;

async function select<T extends object>(db: Sequelize, sql: string, replacements: unknown[] = []) {
  return db.query<T>(sql, { type: QueryTypes.SELECT, replacements });
}

export async function currentAccount(db: Sequelize): Promise<DbAccount> {
  const [{ who }] = await select<{ who: string }>(db, "SELECT CURRENT_USER() AS who");
  return parseAccount(who);
}

async function revokeIgnoringAbsent(db: Sequelize, sql: string) {
  try {
    await db.query(sql);
  } catch (err) {
    if (![NO_SUCH_GRANT, NO_SUCH_TABLE_GRANT].includes(errno(err) ?? 0)) throw err;
  }
}

/**
 * Leaves the app's account with exactly APP_TABLE_RIGHTS on the owner's current database: any
 * schema-wide or table grant it held before is taken away first (an install from before the two
 * accounts gave it ALL PRIVILEGES). Run after every migration, since a new table needs its grant.
 */
export async function applyAppRights(owner: Sequelize, app: DbAccount): Promise<string[]> {
  const [{ db }] = await select<{ db: string }>(owner, "SELECT DATABASE() AS db");
  const self = await currentAccount(owner);
  if (self.user === app.user && self.host === app.host) {
    throw new Error("The owner and the app must be different database accounts");
  }
  const grantee = accountSql(app);
  await revokeIgnoringAbsent(owner, `REVOKE ALL PRIVILEGES ON ${ident(db)}.* FROM ${grantee}`);
  const tables = await select<{ name: string }>(
    owner,
    "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE()",
  );
  for (const { name } of tables) {
    await revokeIgnoringAbsent(owner, `REVOKE ALL PRIVILEGES ON ${ident(db)}.${ident(name)} FROM ${grantee}`);
  }
  const grants = appGrantStatements(db, app);
  for (const sql of grants) await owner.query(sql);
  await ownTriggers(owner, self);
  return grants;
}

/**
 * Re-creates, as the owner, every trigger some other account defined. A trigger runs with its
 * definer's rights, and before the two accounts existed the app's account defined them: once that
 * account lost TRIGGER and UPDATE rights, its triggers would refuse every write they guard.
 */
export async function ownTriggers(owner: Sequelize, self: DbAccount): Promise<number> {
  const triggers = await select<{ name: string }>(
    owner,
    "SELECT trigger_name AS name FROM information_schema.triggers WHERE trigger_schema = DATABASE() AND definer <> ?",
    [`${self.user}@${self.host}`],
  );
  for (const { name } of triggers) {
    const [row] = await select<Record<string, string>>(owner, `SHOW CREATE TRIGGER \`${name}\``);
    const original = row["SQL Original Statement"];
    const replaced = original.replace(/^CREATE\s+DEFINER\s*=\s*\S+\s+TRIGGER/i, "CREATE OR REPLACE TRIGGER");
    if (replaced === original) throw new Error(`Cannot take over trigger ${name}: unexpected definition`);
    await owner.query(replaced);
  }
  return triggers.length;
}
