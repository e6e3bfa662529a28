// `npm start`: install what is missing, start MariaDB and the local fakes on loopback, migrate,
// seed the demo on an empty database, build when sources changed, and serve the app.
import { spawn, execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { ensureNodeModules } from "./lib/deps.mjs";
import { withoutOwnerAccount } from "./lib/db-accounts.mjs";
import { ensureSystemPackages } from "./lib/system.mjs";
import { portIsFree } from "./lib/ports.mjs";
import { localSecrets } from "./lib/secrets.mjs";

const PORT = Number(process.env.PORT ?? 3000);
const DB_PORT = Number(process.env.TW_DB_PORT ?? 3307);

async function main() {
  ensureNodeModules();
  if (!process.env.DATABASE_URL && !process.env.DB_HOST) ensureSystemPackages(["mariadbd"]);
  if (!(await portIsFree(PORT))) throw new Error(`Port ${PORT} is busy. Stop what runs there or set PORT=…`);
  const { startServices } = await import("./lib/services.mjs");
  const { ensureBuild } = await import("./lib/build.mjs");
  const secrets = localSecrets();
  const services = await startServices({
    mode: "start",
    dataRoot: ".data",
    dbPort: DB_PORT,
    smtpPort: Number(process.env.TW_SMTP_PORT ?? 2525),
    s3Port: Number(process.env.TW_S3_PORT ?? 4569),
    mailViewPort: Number(process.env.TW_MAIL_VIEW_PORT ?? 2580),
    secrets,
  });
  let server;
  let stopping = null;
  // One shutdown, however many signals or exits ask for it (a second Ctrl-C must not cut the
  // MariaDB shutdown short and leave mariadbd behind).
  const shutdown = (code = 0) => {
    stopping ??= (async () => {
      console.log("\n[tenthwise] stopping …");
      if (server && server.exitCode === null && server.signalCode === null) {
        server.kill("SIGTERM");
        await new Promise((r) => {
          server.once("exit", r);
          setTimeout(r, 8000);
        });
      }
      await services.stop();
      process.exit(code);
    })();
    return stopping;
  };
  process.on("SIGINT", () => shutdown(0));
  process.on("SIGTERM", () => shutdown(0));

  try {
    const appEnv = {
      ...process.env,
      ...services.env,
      NEXT_TELEMETRY_DISABLED: "1",
      NODE_ENV: "production",
      SESSION_SECRET: process.env.SESSION_SECRET ?? secrets.SESSION_SECRET,
      LINK_SECRET: process.env.LINK_SECRET ?? secrets.LINK_SECRET,
      APP_URL: process.env.APP_URL ?? `http://localhost:${PORT}`,
    };
    execFileSync(
      "node",
      ["node_modules/tsx/dist/cli.mjs", "--conditions=react-server", "scripts/db-setup.ts", "--seed"],
      { stdio: "inherit", env: appEnv },
    );
    ensureBuild();
    // The web server gets the app's database account only; the owner's is for db-setup.
    const serverEnv = withoutOwnerAccount(appEnv);
    server = spawn("node", ["node_modules/next/dist/bin/next", "start", "-p", String(PORT), "-H", "0.0.0.0"], {
      stdio: "inherit",
      env: serverEnv,
    });
    server.on("exit", (code) => {
      if (!stopping) shutdown(code ?? 1);
    });
    const demo = JSON.parse(readFileSync("scripts/demo-accounts.json", "utf8"));
    console.log(
      `\n  Tenthwise is at http://localhost:${PORT}\n\n  Demo sign-ins (demo only), password "${demo.password}":`,
    );
    for (const a of demo.accounts) console.log(`    ${a.role.padEnd(10)} ${a.email}`);
    if (services.mailViewUrl)
      console.log(`\n  Local mail (what the fake mail server received): ${services.mailViewUrl}`);
    console.log("\n  Ctrl-C stops the app, MariaDB and the local fakes.\n");
  } catch (err) {
    console.error(`[tenthwise] ${err.message}`);
    await shutdown(1);
  }
}

main().catch((err) => {
  console.error(`[tenthwise] ${err.message}`);
  process.exit(1);
});
