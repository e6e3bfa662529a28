import "server-only";
import { existsSync } from "node:fs";
import { mkdir, readdir, readFile, rename, rm, writeFile } from "node:fs/promises";
import { join } from "node:path";
import { dumpDatabase, dumpToolVersion, type DbConfig } from "./database";
import { migrationsApplied } from "./db-state";
import { sha256Of } from "./files";
import {
  BACKUP_FORMAT,
  BACKUP_NAME,
  BACKUP_VERSION,
  DUMP_FILE,
  MANIFEST_FILE,
  SUMS_FILE,
  backupFolderName,
  formatSums,
  parseManifest,
  type BackupManifest,
} from "./manifest";
import { checkBucket, copyObjectsOut, type Store } from "./objects";

export type BackupOptions = {
  db: DbConfig;
  store: Store;
  /** The folder the dated backup folders go in. */
  into: string;
  app: { name: string; version: string };
  now?: Date;
  say?: (line: string) => void;
};

/**
 * Dumps the database, then copies every stored object, into `<into>/<date>.partial`, and renames it
 * to `<into>/<date>` once the manifest and checksums are written: a folder without ".partial" is
 * always a finished backup.
 */
export async function takeBackup(opts: BackupOptions): Promise<{ folder: string; manifest: BackupManifest }> {
  const started = opts.now ?? new Date();
  const folder = join(opts.into, backupFolderName(started));
  if (existsSync(folder)) throw new Error(`${folder} already exists; wait a second and run the backup again`);
  const partial = `${folder}.partial`;
  await rm(partial, { recursive: true, force: true });
  await mkdir(partial, { recursive: true, mode: 0o700 });
  try {
    return await writeBackup(opts, started, partial, folder);
  } catch (err) {
    await rm(partial, { recursive: true, force: true }); // a failed backup leaves nothing that looks like one
    throw err;
  }
}

async function writeBackup(opts: BackupOptions, started: Date, partial: string, folder: string) {
  const say = opts.say ?? (() => undefined);
  await checkBucket(opts.store);
  const migrations = await migrationsApplied(opts.db);
  say(`Dumping the database ${opts.db.database} (one consistent snapshot) …`);
  const dump = await dumpDatabase(opts.db, join(partial, DUMP_FILE));
  say(`Copying the stored objects of bucket ${opts.store.bucket} …`);
  const items = await copyObjectsOut(opts.store, partial);

  const manifest: BackupManifest = {
    format: BACKUP_FORMAT,
    version: BACKUP_VERSION,
    app: opts.app,
    startedAt: started.toISOString(),
    finishedAt: new Date().toISOString(),
    database: {
      name: opts.db.database,
      file: DUMP_FILE,
      ...dump,
      dumpTool: await dumpToolVersion(),
      migrations,
    },
    objects: {
      bucket: opts.store.bucket,
      count: items.length,
      bytes: items.reduce((sum, o) => sum + o.bytes, 0),
      items,
    },
  };
  const manifestText = `${JSON.stringify(manifest, null, 2)}\n`;
  await writeFile(join(partial, MANIFEST_FILE), manifestText, { mode: 0o600 });
  const sums = [
    { path: DUMP_FILE, sha256: dump.sha256 },
    ...items.map((o) => ({ path: o.file, sha256: o.sha256 })),
    { path: MANIFEST_FILE, sha256: sha256Of(manifestText) },
  ];
  await writeFile(join(partial, SUMS_FILE), formatSums(sums), { mode: 0o600 });
  await rename(partial, folder);
  return { folder, manifest };
}

/**
 * Keeps the newest `keep` finished backups in `into` and removes the older ones. Only folders named
 * like a backup and holding a Tenthwise manifest are ever removed.
 */
export async function pruneBackups(into: string, keep: number): Promise<string[]> {
  const finished: string[] = [];
  for (const name of (await readdir(into)).filter((n) => BACKUP_NAME.test(n)).sort()) {
    const text = await readFile(join(into, name, MANIFEST_FILE), "utf8").catch(() => null);
    if (text && isManifest(text)) finished.push(join(into, name));
  }
  const old = finished.slice(0, Math.max(0, finished.length - keep));
  for (const folder of old) await rm(folder, { recursive: true, force: true });
  return old;
}

function isManifest(text: string): boolean {
  try {
    parseManifest(text);
    return true;
  } catch {
    return false;
  }
}
