// Migrates the database and, with --seed, seeds the demo scenario when the database is empty.
// Run by `npm start` and `npm test` (through tsx with the react-server condition, so server
// modules load outside Next).
import { getSequelize, closeSequelize } from "@/lib/server/core/db";
import { migrateUp } from "@/lib/server/core/migrate";
import { Shop } from "@/models";
import { seedDemo } from "./seed/demo";

async function main() {
  const sequelize = getSequelize();
  const applied = await migrateUp(sequelize);
  if (applied.length) console.log(`[tenthwise] applied ${applied.length} migration(s)`);
  if (process.argv.includes("--seed") && (await Shop.count()) === 0) {
    await seedDemo();
    console.log("[tenthwise] seeded the demo shop (demo data only)");
  }
  await closeSequelize();
}

main().catch(async (err) => {
  console.error(`[tenthwise] database setup failed: ${err.message}`);
  await closeSequelize().catch(() => undefined);
  process.exit(1);
});
