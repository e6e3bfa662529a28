// `npm run backup [-- --to <folder>] [--keep <n>]`: a dated backup of the database and the stored
// objects (lib/server/backup/manifest.ts says what is in it). Run through scripts/with-services.mjs.
import { readFileSync } from "node:fs";
import { parseArgs } from "node:util";
import { pruneBackups, takeBackup } from "@/lib/server/backup/take";
import { databaseConfig, env } from "@/lib/server/core/env";
import { s3Client } from "@/lib/server/uploads/storage";

const USAGE = "Usage: npm run backup [-- --to <folder>] [--keep <number of backups to keep>]";

function options() {
  const { values } = parseArgs({ options: { to: { type: "string" }, keep: { type: "string" } } });
  const keep = values.keep === undefined ? undefined : Number(values.keep);
  if (keep !== undefined && (!Number.isInteger(keep) || keep < 1))
    throw new Error(`--keep takes a whole number of backups, 1 or more (got "${values.keep}"). ${USAGE}`);
  return { into: values.to ?? env().BACKUP_DIR, keep };
}

const mb = (bytes: number) => `${(bytes / (1024 * 1024)).toFixed(1)} MB`;

async function main() {
  const { into, keep } = options();
  const pkg = JSON.parse(readFileSync("package.json", "utf8")) as { name: string; version: string };
  const started = Date.now();
  const { folder, manifest } = await takeBackup({
    db: databaseConfig("owner"),
    store: { client: s3Client(), bucket: env().S3_BUCKET },
    into,
    app: { name: pkg.name, version: pkg.version },
    say: (line) => console.log(`[backup] ${line}`),
  });
  const { database: db, objects } = manifest;
  console.log(
    `[backup] Done in ${((Date.now() - started) / 1000).toFixed(1)} s: ${folder}\n` +
      `         database ${db.name}: ${mb(db.bytes)}, ${db.migrations.length} migrations applied\n` +
      `         ${objects.count} stored object(s), ${mb(objects.bytes)}\n` +
      `         check it any time with: (cd ${folder} && sha256sum -c --quiet SHA256SUMS)`,
  );
  if (keep) for (const old of await pruneBackups(into, keep)) console.log(`[backup] Removed the older ${old}`);
}

main().catch((err: Error) => {
  console.error(`[backup] FAILED: ${err.message}`);
  process.exit(1);
});
