import "server-only";
import { z } from "zod";

/*
 * A backup folder, format "tenthwise.backup" version 1 (our own):
 *
 *   <folder>/manifest.json   what this is (the schema below)
 *   <folder>/database.sql    mariadb-dump --single-transaction --routines --triggers of the database
 *   <folder>/objects/<key>   one file per stored object, byte for byte (keys that are not plain
 *                            path segments are kept under objects/_/<sha-256 of the key>)
 *   <folder>/SHA256SUMS      "<sha-256 hex>  <path>" per file above, the layout `sha256sum -c` reads
 *
 * manifest.json:
 *   format, version        "tenthwise.backup", 1
 *   app                    { name, version } of the Tenthwise that took it (package.json)
 *   startedAt, finishedAt  ISO 8601 UTC
 *   database               { name, file, bytes, sha256, dumpTool, migrations: names applied, in order }
 *   objects                { bucket, count, bytes, items: [{ key, file, bytes, sha256, contentType }] }
 *
 * The database is dumped first and the objects copied after it: a photo is stored before its row is
 * committed and never deleted once its row exists, so every photo the dump names is in the copy.
 */
export const BACKUP_FORMAT = "tenthwise.backup";
export const BACKUP_VERSION = 1;
export const MANIFEST_FILE = "manifest.json";
export const SUMS_FILE = "SHA256SUMS";
export const DUMP_FILE = "database.sql";
export const OBJECTS_DIR = "objects";

const sha256 = z.string().regex(/^[0-9a-f]{64}$/, "a SHA-256 in hex");

export const objectEntrySchema = z.object({
  key: z.string().min(1),
  file: z.string().min(1),
  bytes: z.number().int().min(0),
  sha256,
  contentType: z.string().nullable(),
});

export const manifestSchema = z.object({
  format: z.literal(BACKUP_FORMAT),
  version: z.literal(BACKUP_VERSION),
  app: z.object({ name: z.string(), version: z.string() }),
  startedAt: z.string(),
  finishedAt: z.string(),
  database: z.object({
    name: z.string(),
    file: z.literal(DUMP_FILE),
    bytes: z.number().int().min(0),
    sha256,
    dumpTool: z.string(),
    migrations: z.array(z.string()),
  }),
  objects: z.object({
    bucket: z.string(),
    count: z.number().int().min(0),
    bytes: z.number().int().min(0),
    items: z.array(objectEntrySchema),
  }),
});

export type BackupManifest = z.infer<typeof manifestSchema>;
export type ObjectEntry = z.infer<typeof objectEntrySchema>;

/** The folder name for a backup started at `at`: 2026-12-03T093012Z (sorts by time, no colons). */
export function backupFolderName(at: Date): string {
  return at
    .toISOString()
    .replace(/[-:]/g, "")
    .replace(/\.\d+Z$/, "Z")
    .replace(/^(\d{4})(\d{2})(\d{2})/, "$1-$2-$3");
}

export const BACKUP_NAME = /^\d{4}-\d{2}-\d{2}T\d{6}Z$/;

const PLAIN_KEY = /^[A-Za-z0-9_][A-Za-z0-9._-]*(\/[A-Za-z0-9_][A-Za-z0-9._-]*)*$/;

/** Where an object's bytes live in the folder: its key as a path when that is safe, else a digest. */
export function objectFile(key: string, keyDigest: string): string {
  return PLAIN_KEY.test(key) ? `${OBJECTS_DIR}/${key}` : `${OBJECTS_DIR}/_/${keyDigest}`;
}

/** A path from a manifest or sums file, refused when it could leave the folder. */
export function safeRelativePath(path: string): boolean {
  return !path.startsWith("/") && !path.split("/").some((p) => p === ".." || p === "" || p === ".");
}

export function formatSums(sums: { path: string; sha256: string }[]): string {
  return sums.map((s) => `${s.sha256}  ${s.path}\n`).join("");
}

/** SHA256SUMS back into entries; a line that is not "<64 hex>  <path>" is named. */
export function parseSums(text: string): { path: string; sha256: string }[] {
  return text
    .split("\n")
    .filter((line) => line.trim() !== "")
    .map((line, i) => {
      const m = /^([0-9a-f]{64}) [ *](.+)$/.exec(line);
      if (!m || !safeRelativePath(m[2])) throw new Error(`${SUMS_FILE} line ${i + 1} is not "<sha-256>  <file>"`);
      return { sha256: m[1], path: m[2] };
    });
}

/** The manifest, or words saying what is wrong with it. */
export function parseManifest(text: string): BackupManifest {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw new Error(`${MANIFEST_FILE} is not JSON; this folder is not a Tenthwise backup or it is damaged`);
  }
  const parsed = manifestSchema.safeParse(raw);
  if (!parsed.success) {
    const where = parsed.error.issues.slice(0, 3).map((i) => `${i.path.join(".") || "(top)"}: ${i.message}`);
    throw new Error(
      `${MANIFEST_FILE} is not a ${BACKUP_FORMAT} version ${BACKUP_VERSION} manifest (${where.join("; ")})`,
    );
  }
  return parsed.data;
}
