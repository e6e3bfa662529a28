// Brings up everything the app needs locally (MariaDB and the fakes) unless the environment
// points at real services. Returns the env for the app and one stop() for all of it.
import { attachMariaDb, startMariaDb } from "./mariadb.mjs";
import { attachFakeS3, startFakeS3, startFakeSmtp } from "./fakes.mjs";
import { portIsFree } from "./ports.mjs";

// With `reuse` (backup and restore), a local service already answering on its port (npm start's)
// is used as it is, and the mail fake is not started at all.
export async function startServices({ mode, dataRoot, dbPort, smtpPort, s3Port, secrets, reuse = false }) {
  const stops = [];
  const env = {};
  const throwaway = mode === "test";
  try {
    if (!process.env.DATABASE_URL && !process.env.DB_HOST) {
      const start = reuse && !(await portIsFree(dbPort)) ? attachMariaDb : startMariaDb;
      const db = await start({
        dataDir: `${dataRoot}/mariadb`,
        port: dbPort,
        database: throwaway ? "tenthwise_test" : "tenthwise",
        user: "tenthwise",
        password: secrets.DB_APP_PASSWORD,
        throwaway,
        // Tests get a second, empty database so the migrations test can run every down and up
        // without touching the seeded one the app and other tests use, and a third, empty one
        // the backup test restores into.
        extraDatabases: throwaway ? ["tenthwise_scratch", "tenthwise_restore"] : [],
      });
      stops.push(db.stop);
      env.DATABASE_URL = db.url;
      env.TW_DB_SOCKET = db.socket;
      if (throwaway) env.TW_SCRATCH_DATABASE_URL = db.urlFor("tenthwise_scratch");
      if (throwaway) env.TW_RESTORE_DATABASE_URL = db.urlFor("tenthwise_restore");
      console.log(`[tenthwise] MariaDB ready on 127.0.0.1:${dbPort}${throwaway ? " (throwaway)" : ""}`);
    }
    if (!process.env.SMTP_HOST && !reuse) {
      const smtp = await startFakeSmtp({ port: smtpPort, mailDir: `${dataRoot}/mail` });
      stops.push(smtp.stop);
      Object.assign(env, { SMTP_HOST: "127.0.0.1", SMTP_PORT: String(smtpPort), MAIL_DIR: smtp.mailDir });
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
  return { env, stop: stopAll };
}
