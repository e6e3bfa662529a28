// `npm run restore -- <backup folder> [--force]`: checks the backup's checksums, then restores the
// database and the stored objects into an empty database and bucket. Run through with-services.mjs.
import { parseArgs } from "node:util";
import { restoreBackup } from "@/lib/server/backup/restore";
import { databaseConfig, env } from "@/lib/server/core/env";
import { s3Client } from "@/lib/server/uploads/storage";
import { migrations } from "@/migrations";

const USAGE = "Usage: npm run restore -- <backup folder> [--force]";

async function main() {
  const { values, positionals } = parseArgs({ options: { force: { type: "boolean" } }, allowPositionals: true });
  if (positionals.length !== 1) throw new Error(`Name one backup folder. ${USAGE}`);
  const result = await restoreBackup({
    folder: positionals[0],
    db: databaseConfig("owner"),
    store: { client: s3Client(), bucket: env().S3_BUCKET },
    force: values.force ?? false,
    knownMigrations: migrations.map((m) => m.name),
    say: (line) => console.log(`[restore] ${line}`),
  });
  const counts = Object.entries(result.counts).map(([table, n]) => `${table} ${n}`);
  console.log(
    `[restore] Done: the backup of ${result.manifest.startedAt} is restored.\n` +
      `          rows: ${counts.join(", ")}\n          stored objects: ${result.manifest.objects.count}`,
  );
  if (result.missingObjects.length)
    console.log(
      `[restore] WARNING: ${result.missingObjects.length} file(s) named in the database are not in the store ` +
        `(first: ${result.missingObjects[0]}); their photos will show as missing.`,
    );
  if (result.pendingMigrations.length)
    console.log(
      `[restore] This version has ${result.pendingMigrations.length} migration(s) the backup had not run; ` +
        "npm start (or npm run db:setup) applies them.",
    );
}

main().catch((err: Error) => {
  console.error(`[restore] ${err.message}`);
  process.exit(1);
});
