// A connection as the schema's owner (DB_OWNER_USER, set by npm test), for tests that must change
// rows the app's own account may not touch (a tampered figure, a removed mail). The app and the
// factories connect as the app's account, with only its rights (lib/server/core/db-rights.ts).
import { QueryTypes, Sequelize } from "sequelize";

let owner: Sequelize | undefined;

export function ownerDb(): Sequelize {
  const user = process.env.DB_OWNER_USER;
  if (!user || !process.env.DATABASE_URL) throw new Error("npm test sets DB_OWNER_USER for the owner's account");
  const u = new URL(process.env.DATABASE_URL);
  u.username = encodeURIComponent(user);
  u.password = encodeURIComponent(process.env.DB_OWNER_PASSWORD ?? "");
  owner ??= new Sequelize(u.toString(), { dialect: "mariadb", logging: false, timezone: "+00:00" });
  return owner;
}

/** Runs one statement as the owner. */
export async function asOwner(sql: string, replacements: unknown[] = []): Promise<void> {
  await ownerDb().query(sql, { replacements, type: QueryTypes.RAW });
}

export async function closeOwnerDb(): Promise<void> {
  await owner?.close();
  owner = undefined;
}
