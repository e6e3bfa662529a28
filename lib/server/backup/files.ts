import "server-only";
import { createHash } from "node:crypto";
import { createReadStream, createWriteStream } from "node:fs";
import { mkdir, readFile } from "node:fs/promises";
import { dirname, join } from "node:path";
import { Transform, type Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import { MANIFEST_FILE, SUMS_FILE, parseManifest, parseSums, type BackupManifest } from "./manifest";

export type Written = { bytes: number; sha256: string };

/** Streams `source` into `path` (folders made as needed), hashing on the way; nothing is held in memory. */
export async function writeHashed(source: Readable, path: string): Promise<Written> {
  await mkdir(dirname(path), { recursive: true });
  const hash = createHash("sha256");
  let bytes = 0;
  const tap = new Transform({
    transform(chunk: Buffer, _enc, done) {
      hash.update(chunk);
      bytes += chunk.length;
      done(null, chunk);
    },
  });
  await pipeline(source, tap, createWriteStream(path, { mode: 0o600 }));
  return { bytes, sha256: hash.digest("hex") };
}

export async function hashFile(path: string): Promise<Written> {
  const hash = createHash("sha256");
  let bytes = 0;
  for await (const chunk of createReadStream(path) as AsyncIterable<Buffer>) {
    hash.update(chunk);
    bytes += chunk.length;
  }
  return { bytes, sha256: hash.digest("hex") };
}

export const sha256Of = (text: string) => createHash("sha256").update(text).digest("hex");

/**
 * Every file of the folder checked against SHA256SUMS, and the manifest's own figures against the
 * files, before anything is restored. Throws words naming each file that does not match.
 */
export async function verifyFolder(folder: string): Promise<BackupManifest> {
  const sumsText = await readFile(join(folder, SUMS_FILE), "utf8").catch(() => {
    throw new Error(`${folder} has no ${SUMS_FILE}: it is not a finished Tenthwise backup`);
  });
  const sums = parseSums(sumsText);
  const listed = new Map(sums.map((s) => [s.path, s.sha256]));
  const problems: string[] = [];
  for (const { path, sha256 } of sums) {
    const found = await hashFile(join(folder, path)).catch(() => null);
    if (!found) problems.push(`${path} is missing`);
    else if (found.sha256 !== sha256) problems.push(`${path} does not match its checksum`);
  }
  if (!listed.has(MANIFEST_FILE)) problems.push(`${MANIFEST_FILE} is not listed in ${SUMS_FILE}`);
  if (problems.length) throw checksumError(folder, problems);
  const manifest = parseManifest(await readFile(join(folder, MANIFEST_FILE), "utf8"));
  const expected = [
    { path: manifest.database.file, sha256: manifest.database.sha256 },
    ...manifest.objects.items.map((o) => ({ path: o.file, sha256: o.sha256 })),
  ];
  for (const e of expected)
    if (listed.get(e.path) !== e.sha256) problems.push(`${e.path}: the manifest and ${SUMS_FILE} disagree`);
  if (problems.length) throw checksumError(folder, problems);
  return manifest;
}

function checksumError(folder: string, problems: string[]): Error {
  const shown = problems.slice(0, 10).map((p) => `  - ${p}`);
  if (problems.length > 10) shown.push(`  - … and ${problems.length - 10} more`);
  return new Error(
    `Refusing to restore: the backup in ${folder} is damaged or incomplete (nothing was changed):\n` +
      `${shown.join("\n")}\nRestore from another copy of this backup, or from an older one.`,
  );
}
