import "server-only";
import { join } from "node:path";
import { loadDump, type DbConfig } from "./database";
import { attachmentKeys, emptyDatabase, rowCounts, tablesWithRows, type RowCounts } from "./db-state";
import { verifyFolder } from "./files";
import type { BackupManifest } from "./manifest";
import { checkBucket, copyObjectsIn, missingKeys, objectsNotIntact, storeIsEmpty, type Store } from "./objects";

export type RestoreOptions = {
  folder: string;
  db: DbConfig;
  store: Store;
  /** Replace a database that holds data, and write over a bucket that holds objects. */
  force?: boolean;
  /** The migrations this version of Tenthwise knows, in order. */
  knownMigrations: string[];
  say?: (line: string) => void;
};

export type RestoreResult = {
  manifest: BackupManifest;
  counts: RowCounts;
  /** Object keys named by attachment rows that the store does not hold after the restore. */
  missingObjects: string[];
  /** Migrations of this version the backup had not applied yet (db:setup applies them). */
  pendingMigrations: string[];
};

export const SUMMARY_TABLES = ["shops", "users", "jobs", "readings", "releases", "attachments", "audit_events"];

function refuseNewer(manifest: BackupManifest, known: string[]) {
  const unknown = manifest.database.migrations.filter((m) => !known.includes(m));
  if (unknown.length)
    throw new Error(
      `Refusing to restore: this backup was taken by a newer Tenthwise (${manifest.app.version}); its database ` +
        `has migrations this version does not know (${unknown.slice(0, 3).join(", ")}). Update Tenthwise first.`,
    );
}

async function refuseOccupied(opts: RestoreOptions, say: (line: string) => void) {
  const tables = await tablesWithRows(opts.db);
  const storeEmpty = await storeIsEmpty(opts.store);
  if (!tables.length && storeEmpty) return;
  const what = [
    ...(tables.length ? [`the database ${opts.db.database} holds data (${tables.slice(0, 5).join(", ")} …)`] : []),
    ...(storeEmpty ? [] : [`the bucket ${opts.store.bucket} holds objects`]),
  ].join(" and ");
  if (!opts.force)
    throw new Error(
      `Refusing to restore: ${what}. Restore into an empty database and bucket, or run again with --force ` +
        "to REPLACE everything in the database and write the backup's objects over the bucket's.",
    );
  say(`WARNING: --force given and ${what}: the database is being replaced by the backup's.`);
}

/**
 * Checks every checksum first (a damaged backup changes nothing), refuses a database or bucket
 * that holds data unless forced, then loads the dump and puts every object back.
 */
export async function restoreBackup(opts: RestoreOptions): Promise<RestoreResult> {
  const say = opts.say ?? (() => undefined);
  say(`Checking the checksums of ${opts.folder} …`);
  const manifest = await verifyFolder(opts.folder);
  refuseNewer(manifest, opts.knownMigrations);
  await checkBucket(opts.store);
  await refuseOccupied(opts, say);

  say(`Loading the database dump into ${opts.db.database} …`);
  try {
    await emptyDatabase(opts.db);
    await loadDump(opts.db, join(opts.folder, manifest.database.file));
  } catch (err) {
    throw new Error(
      `${(err as Error).message}\nThe database may now be partly loaded: fix the cause and run the restore ` +
        "again with --force.",
      { cause: err },
    );
  }
  say(`Putting ${manifest.objects.count} object(s) back into bucket ${opts.store.bucket} …`);
  await copyObjectsIn(opts.store, opts.folder, manifest.objects.items);
  const damaged = await objectsNotIntact(opts.store, manifest.objects.items);
  if (damaged.length)
    throw new Error(
      `${damaged.length} object(s) did not arrive in bucket ${opts.store.bucket} at their backed-up size ` +
        `(first: ${damaged[0]}). Check the store, then run the restore again with --force.`,
    );

  return {
    manifest,
    counts: await rowCounts(opts.db, SUMMARY_TABLES),
    missingObjects: await missingKeys(opts.store, await attachmentKeys(opts.db)),
    pendingMigrations: opts.knownMigrations.filter((m) => !manifest.database.migrations.includes(m)),
  };
}
