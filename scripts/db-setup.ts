// Migrates the database and, with --seed, seeds the demo scenario when the database is empty; then
// grants the app's account its table rights (lib/server/core/db-rights.ts). Migrations and seeding
// run as the schema's owner (DB_OWNER_USER) when one is set. Run by `npm start` and `npm test`
// (through tsx with the react-server condition, so server modules load outside Next).
import { getSequelize, closeSequelize, connectAsOwner, openSequelize } from "@/lib/server/core/db";
import { applyAppRights, currentAccount } from "@/lib/server/core/db-rights-apply";
import { hasOwnerAccount } from "@/lib/server/core/env";
import { migrateUp } from "@/lib/server/core/migrate";
import { Shop } from "@/models";
import { seedDemo } from "./seed/demo";

async function grantAppRights() {
  // information_schema: the app's account may hold no right on its database yet.
  const app = openSequelize("app", "information_schema");
  try {
    const account = await currentAccount(app);
    const grants = await applyAppRights(getSequelize(), account);
    console.log(`[tenthwise] granted ${account.user}@${account.host} its rights on ${grants.length} tables`);
  } finally {
    await app.close();
  }
}

async function main() {
  if (hasOwnerAccount()) connectAsOwner();
  else console.warn("[tenthwise] DB_OWNER_USER is not set: migrating as the app's own account (see README)");
  const sequelize = getSequelize();
  const applied = await migrateUp(sequelize);
  if (applied.length) console.log(`[tenthwise] applied ${applied.length} migration(s)`);
  if (process.argv.includes("--seed") && (await Shop.count()) === 0) {
    await seedDemo();
    console.log("[tenthwise] seeded the demo shop (demo data only)");
  }
  if (hasOwnerAccount()) await grantAppRights();
  await closeSequelize();
}

main().catch(async (err) => {
  console.error(`[tenthwise] database setup failed: ${err.message}`);
  await closeSequelize().catch(() => undefined);
  process.exit(1);
});
