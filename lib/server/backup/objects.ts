import "server-only";
import { createReadStream } from "node:fs";
import { join } from "node:path";
import type { Readable } from "node:stream";
import {
  GetObjectCommand,
  HeadBucketCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  type S3Client,
} from "@aws-sdk/client-s3";
import { sha256Of, writeHashed } from "./files";
import { objectFile, type ObjectEntry } from "./manifest";

// The stored-objects half of a backup, through the S3 API (any S3-compatible store): every key is
// listed, and each object streamed to its own file and back, never held whole in memory.

export type Store = { client: S3Client; bucket: string };

// Pages of the store's own size (no MaxKeys: the local fake fails on a page cut short by one).
async function* listObjects(store: Store): AsyncGenerator<{ key: string; size: number }> {
  let token: string | undefined;
  do {
    const page = await store.client.send(new ListObjectsV2Command({ Bucket: store.bucket, ContinuationToken: token }));
    for (const o of page.Contents ?? []) if (o.Key) yield { key: o.Key, size: o.Size ?? -1 };
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
}

/** Words that say what to fix when the bucket cannot be reached. */
export async function checkBucket(store: Store): Promise<void> {
  try {
    await store.client.send(new HeadBucketCommand({ Bucket: store.bucket }));
  } catch (err) {
    const why =
      (err as { name?: string }).name === "NotFound" ? "does not exist" : `cannot be reached (${String(err)})`;
    throw new Error(`The bucket "${store.bucket}" ${why}: check S3_ENDPOINT, S3_BUCKET and the S3 credentials`, {
      cause: err,
    });
  }
}

export async function storeIsEmpty(store: Store): Promise<boolean> {
  for await (const _object of listObjects(store)) return false;
  return true;
}

/** Copies every object of the bucket into `<folder>/objects/…`, returning what the manifest lists. */
export async function copyObjectsOut(store: Store, folder: string): Promise<ObjectEntry[]> {
  const entries: ObjectEntry[] = [];
  for await (const { key } of listObjects(store)) {
    const out = await store.client.send(new GetObjectCommand({ Bucket: store.bucket, Key: key }));
    if (!out.Body) throw new Error(`The store returned no content for object ${key}`);
    const file = objectFile(key, sha256Of(key));
    const written = await writeHashed(out.Body as Readable, join(folder, file));
    entries.push({ key, file, ...written, contentType: out.ContentType ?? null });
  }
  return entries;
}

/** Puts every object of the backup back under its own key and content type. */
export async function copyObjectsIn(store: Store, folder: string, items: ObjectEntry[]): Promise<void> {
  for (const item of items) {
    await store.client.send(
      new PutObjectCommand({
        Bucket: store.bucket,
        Key: item.key,
        Body: createReadStream(join(folder, item.file)),
        ContentLength: item.bytes,
        ...(item.contentType ? { ContentType: item.contentType } : {}),
      }),
    );
  }
}

async function heldSizes(store: Store): Promise<Map<string, number>> {
  const held = new Map<string, number>();
  for await (const o of listObjects(store)) held.set(o.key, o.size);
  return held;
}

/** The backup's objects the store does not hold at their backed-up size, after a restore. */
export async function objectsNotIntact(store: Store, items: ObjectEntry[]): Promise<string[]> {
  const held = await heldSizes(store);
  return items.filter((o) => held.get(o.key) !== o.bytes).map((o) => o.key);
}

/** The keys of `wanted` the store does not hold. */
export async function missingKeys(store: Store, wanted: string[]): Promise<string[]> {
  const held = await heldSizes(store);
  return wanted.filter((k) => !held.has(k));
}
