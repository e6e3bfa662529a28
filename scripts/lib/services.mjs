// Brings up everything the app needs locally (MariaDB and the fakes) unless the environment
// points at real services. Returns the env for the app and one stop() for all of it.
import { attachMariaDb, startMariaDb } from "./mariadb.mjs";
import { accountStatements, accountsEnv, OWNER_USER } from "./db-accounts.mjs";
import { attachFakeS3, startFakeS3, startFakeSmtp } from "./fakes.mjs";
import { startMailView } from "./mail-view.mjs";
import { portIsFree } from "./ports.mjs";

// With `reuse` (backup and restore), a local service already answering on its port (npm start's)
// is used as it is, and the mail fake is not started at all.
// With `mailViewPort` (npm start), the fake's messages are shown on a local web page too.
// With `withDatabase: false` (the cluster scripts, which run their own Galera nodes), only the fakes.
export async function startServices({
  mode,
  dataRoot,
  dbPort,
  smtpPort,
  s3Port,
  secrets,
  reuse = false,
  mailViewPort,
  withDatabase = true,
}) {
  const stops = [];
  const env = {};
  let mailViewUrl = null;
  const throwaway = mode === "test";
  try {
    if (withDatabase && !process.env.DATABASE_URL && !process.env.DB_HOST) {
      const database = throwaway ? "tenthwise_test" : "tenthwise";
      // Tests get a second, empty database so the migrations test can run every down and up
      // without touching the seeded one the app and other tests use, and a third, empty one
      // the backup test restores into.
      const databases = [database, ...(throwaway ? ["tenthwise_scratch", "tenthwise_restore"] : [])];
      const passwords = { ownerPassword: secrets.DB_OWNER_PASSWORD, appPassword: secrets.DB_APP_PASSWORD };
      const start = reuse && !(await portIsFree(dbPort)) ? attachMariaDb : startMariaDb;
      const db = await start({
        dataDir: `${dataRoot}/mariadb`,
        port: dbPort,
        databases,
        accountStatements: accountStatements({ databases, ...passwords }),
        throwaway,
      });
      stops.push(db.stop);
      Object.assign(env, accountsEnv(db, database, passwords));
      env.TW_DB_SOCKET = db.socket;
      if (throwaway) {
        // The migrations test drops and builds tables there, and a restore loads a whole schema:
        // only the owner may.
        const owner = { user: OWNER_USER, password: passwords.ownerPassword };
        env.TW_SCRATCH_DATABASE_URL = db.urlFor("tenthwise_scratch", owner);
        env.TW_RESTORE_DATABASE_URL = db.urlFor("tenthwise_restore", owner);
      }
      console.log(`[tenthwise] MariaDB ready on 127.0.0.1:${dbPort}${throwaway ? " (throwaway)" : ""}`);
    }
    if (!process.env.SMTP_HOST && !reuse) {
      const smtp = await startFakeSmtp({ port: smtpPort, mailDir: `${dataRoot}/mail` });
      stops.push(smtp.stop);
      Object.assign(env, { SMTP_HOST: "127.0.0.1", SMTP_PORT: String(smtpPort), MAIL_DIR: smtp.mailDir });
      if (mailViewPort) {
        const view = await startMailView({ port: mailViewPort, mailDir: smtp.mailDir });
        stops.push(view.stop);
        mailViewUrl = view.url;
      }
    }
    if (!process.env.S3_ENDPOINT) {
      const startS3 = reuse && !(await portIsFree(s3Port)) ? attachFakeS3 : startFakeS3;
      const s3 = await startS3({ port: s3Port, dir: `${dataRoot}/s3`, bucket: "tenthwise" });
      stops.push(s3.stop);
      Object.assign(env, {
        S3_ENDPOINT: s3.endpoint,
        S3_BUCKET: "tenthwise",
        S3_ACCESS_KEY_ID: "S3RVER",
        S3_SECRET_ACCESS_KEY: "S3RVER",
      });
    }
  } catch (err) {
    for (const stop of stops.reverse()) await stop().catch(() => {});
    throw err;
  }
  let stopped = false;
  async function stopAll() {
    if (stopped) return;
    stopped = true;
    for (const stop of stops.reverse()) await stop().catch((e) => console.error("[tenthwise] stop failed:", e.message));
  }
  return { env, mailViewUrl, stop: stopAll };
}
