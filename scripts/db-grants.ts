// `npm run db:grants`: prints the SQL an administrator runs once, as root, on an existing MariaDB
// to create the schema owner's and the app's accounts; `-- --apply` grants the app its table
// rights on a migrated schema, connected as the owner (db-setup does this after every migration).
// Both come from lib/server/core/db-rights.ts, like the local MariaDB of npm start and npm test.
//   npm run db:grants -- [--database tenthwise] [--owner-user tenthwise_owner] [--app-user tenthwise]
//     [--host %] [--apply]
// Passwords come from DB_OWNER_PASSWORD and DB_PASSWORD when set, else placeholders to replace.
import { parseArgs } from "node:util";
import { accountStatements, appGrantStatements } from "@/lib/server/core/db-rights";

const { values } = parseArgs({
  options: {
    apply: { type: "boolean", default: false },
    // Only the statements that need no table yet (npm start and npm test run them as root).
    "accounts-only": { type: "boolean", default: false },
    database: { type: "string", default: process.env.DB_NAME ?? "tenthwise" },
    "owner-user": { type: "string", default: process.env.DB_OWNER_USER ?? "tenthwise_owner" },
    "app-user": { type: "string", default: process.env.DB_USER ?? "tenthwise" },
    host: { type: "string", default: "%" },
    "extra-database": { type: "string", multiple: true, default: [] },
  },
});

async function apply() {
  const { closeSequelize, connectAsOwner, getSequelize, openSequelize } = await import("@/lib/server/core/db");
  const { applyAppRights, currentAccount } = await import("@/lib/server/core/db-rights-apply");
  const { hasOwnerAccount } = await import("@/lib/server/core/env");
  if (!hasOwnerAccount()) throw new Error("Set DB_OWNER_USER and DB_OWNER_PASSWORD: the owner grants the rights");
  connectAsOwner();
  // information_schema: the app's account may hold no right on its database yet.
  const app = openSequelize("app", "information_schema");
  try {
    const grants = await applyAppRights(getSequelize(), await currentAccount(app));
    console.log(grants.join("\n"));
  } finally {
    await app.close();
    await closeSequelize();
  }
}

function print() {
  const host = values.host;
  const owner = { user: values["owner-user"], host, password: process.env.DB_OWNER_PASSWORD ?? "<owner password>" };
  const app = { user: values["app-user"], host, password: process.env.DB_PASSWORD ?? "<app password>" };
  const databases = [values.database, ...values["extra-database"]];
  console.log("-- As root, once: the two accounts and the owner's rights on the schema.");
  console.log(accountStatements({ databases, owner, app }).join("\n"));
  if (values["accounts-only"]) return;
  console.log("-- Then `npm run db:setup` migrates as the owner and grants the app, per table:");
  console.log(appGrantStatements(values.database, app).join("\n"));
}

if (values.apply) {
  apply().catch((err) => {
    console.error(`[tenthwise] granting the app's rights failed: ${err.message}`);
    process.exit(1);
  });
} else print();
