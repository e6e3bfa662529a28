import "server-only";
import { DeleteObjectCommand, GetObjectCommand, NoSuchKey, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { env } from "@/lib/server/core/env";

// Object storage for photos and files: any S3-compatible store (s3rver locally). Keys are
// always made by us (`<shopId>/<uuid>`), never taken from a request.
const holder = globalThis as unknown as { __tenthwiseS3?: S3Client };

/** The one S3 client on the app's settings (backups use it for their bucket too). */
export function s3Client(): S3Client {
  if (!holder.__tenthwiseS3) {
    const e = env();
    holder.__tenthwiseS3 = new S3Client({
      region: e.S3_REGION,
      ...(e.S3_ENDPOINT ? { endpoint: e.S3_ENDPOINT } : {}),
      forcePathStyle: e.S3_FORCE_PATH_STYLE,
      credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
      // Checksums only where S3 requires them: with a streamed body (a restore) the SDK would
      // otherwise send aws-chunked trailers, which S3-compatible stores (s3rver) keep as the content.
      requestChecksumCalculation: "WHEN_REQUIRED",
    });
  }
  return holder.__tenthwiseS3;
}

const bucket = () => env().S3_BUCKET;

export async function putObject(key: string, body: Buffer, contentType: string): Promise<void> {
  await s3Client().send(
    new PutObjectCommand({
      Bucket: bucket(),
      Key: key,
      Body: body,
      ContentType: contentType,
      ContentLength: body.length,
    }),
  );
}

export async function deleteObject(key: string): Promise<void> {
  await s3Client().send(new DeleteObjectCommand({ Bucket: bucket(), Key: key }));
}

export type StoredObject = { stream: ReadableStream; length?: number };

/** The object as a web stream for a Response, or null when the store does not have it. */
export async function getObjectStream(key: string): Promise<StoredObject | null> {
  try {
    const out = await s3Client().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
    if (!out.Body) return null;
    return { stream: out.Body.transformToWebStream(), length: out.ContentLength };
  } catch (err) {
    if (err instanceof NoSuchKey || (err as { name?: string }).name === "NoSuchKey") return null;
    throw err;
  }
}

/** The whole object in memory (thumbnails for the build record), or null when missing. */
export async function getObjectBuffer(key: string): Promise<Buffer | null> {
  try {
    const out = await s3Client().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
    if (!out.Body) return null;
    return Buffer.from(await out.Body.transformToByteArray());
  } catch (err) {
    if (err instanceof NoSuchKey || (err as { name?: string }).name === "NoSuchKey") return null;
    throw err;
  }
}
