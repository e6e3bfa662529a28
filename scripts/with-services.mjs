// `npm run backup` and `npm run restore`: runs a TypeScript script with the environment the app uses.
// A configured install (DATABASE_URL or DB_HOST set) is used exactly as configured. A local checkout
// uses the MariaDB and fake store that `npm start` runs (its ports, .data/secrets.json), and when
// npm start is not running starts them on .data for the duration, so a restore works on wiped data.
import { spawn } from "node:child_process";
import { localSecrets } from "./lib/secrets.mjs";

const [script, ...args] = process.argv.slice(2);

async function localEnv() {
  const { startServices } = await import("./lib/services.mjs");
  const secrets = localSecrets();
  const services = await startServices({
    mode: "start",
    dataRoot: ".data",
    dbPort: Number(process.env.TW_DB_PORT ?? 3307),
    s3Port: Number(process.env.TW_S3_PORT ?? 4569),
    secrets,
    reuse: true,
  });
  const env = {
    ...services.env,
    SESSION_SECRET: process.env.SESSION_SECRET ?? secrets.SESSION_SECRET,
    LINK_SECRET: process.env.LINK_SECRET ?? secrets.LINK_SECRET,
  };
  return { env, stop: services.stop };
}

async function main() {
  const configured = Boolean(process.env.DATABASE_URL || process.env.DB_HOST);
  const local = configured ? { env: {}, stop: async () => {} } : await localEnv();
  const child = spawn("node", ["node_modules/tsx/dist/cli.mjs", "--conditions=react-server", script, ...args], {
    stdio: "inherit",
    env: { ...process.env, ...local.env, NODE_ENV: process.env.NODE_ENV ?? "production" },
  });
  // Ctrl-C reaches the child through the terminal; we only wait for it, then stop what we started.
  process.on("SIGINT", () => undefined);
  process.on("SIGTERM", () => child.kill("SIGTERM"));
  const code = await new Promise((resolve) => child.on("exit", (c) => resolve(c ?? 1)));
  await local.stop();
  process.exit(code);
}

main().catch((err) => {
  console.error(`[tenthwise] ${err.message}`);
  process.exit(1);
});
