// `npm run shop:create -- --name … --admin-email … [--admin-name …] [--units in|mm]`: makes a
// shop with its first admin and starter spec sheets, and prints the admin's one-time link to
// choose a password. Runs through scripts/with-services.mjs (the local database of `npm start`
// unless DATABASE_URL or DB_HOST says otherwise); the database is migrated already (`npm start`,
// or `npm run db:setup` on a host).
import { closeSequelize } from "@/lib/server/core/db";
import { createShopFromCommand, parseShopCreateArgs } from "@/lib/server/shops/command";

async function main() {
  const input = parseShopCreateArgs(process.argv.slice(2));
  const r = await createShopFromCommand(input);
  console.log(
    [
      `Made shop "${input.shopName}" (id ${r.shopId}) with admin ${input.adminName} <${input.email}>,`,
      "and its three starter spec sheets (typical figures, marked common practice).",
      "",
      `Send this one-time link to ${input.email}; it works once, until ${r.expiresAt.toISOString()}:`,
      `  ${r.link}`,
      "There they choose a password; then they sign in and invite the rest of the shop.",
    ].join("\n"),
  );
}

main()
  .then(() => closeSequelize())
  .catch(async (err: Error) => {
    console.error(err.message);
    await closeSequelize().catch(() => undefined);
    process.exit(1);
  });
