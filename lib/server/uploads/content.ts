import "server-only";
import { fileTypeFromBuffer } from "file-type";
import sharp from "sharp";
import { AppError } from "@/lib/server/core/errors";
import { canonicalText } from "@/lib/schemas/canonical-text";

// What a file really is, from its bytes (never from its name or the browser's Content-Type),
// and a small JPEG preview for photos. JPEG because the PDF library embeds only JPEG and PNG.
export const ALLOWED_TYPES: Record<string, { label: string; image: boolean }> = {
  "image/jpeg": { label: "JPEG photo", image: true },
  "image/png": { label: "PNG image", image: true },
  "image/webp": { label: "WebP image", image: true },
  "image/heic": { label: "HEIC photo", image: true },
  "image/heif": { label: "HEIF photo", image: true },
  "application/pdf": { label: "PDF", image: false },
};

const ALLOWED_WORDS = "a photo (JPEG, PNG, WebP or HEIC) or a PDF";
export const THUMB_SIZE = 320;

export function formatBytes(n: number): string {
  if (n >= 1024 * 1024) return `${(n / (1024 * 1024)).toFixed(1)} MB`;
  if (n >= 1024) return `${Math.round(n / 1024)} KB`;
  return `${n} bytes`;
}

export function tooLarge(size: number | null, max: number): AppError {
  const what = size ? `The file is ${formatBytes(size)}; the` : "The";
  return new AppError(
    "payload_too_large",
    `${what} largest file Tenthwise accepts is ${formatBytes(max)}. ` +
      "Take the photo at a lower resolution or send a smaller PDF.",
  );
}

/** The sniffed MIME type, or a 415 that says what the file looks like and what is accepted. */
export async function sniffType(buf: Buffer, name: string): Promise<string> {
  const found = await fileTypeFromBuffer(buf);
  if (found && ALLOWED_TYPES[found.mime]) return found.mime;
  const looks = found
    ? `looks like ${found.ext.toUpperCase()} (${found.mime})`
    : "is not a type Tenthwise can recognise";
  throw new AppError("unsupported_media", `"${name}" ${looks}, whatever its name says. Upload ${ALLOWED_WORDS}.`);
}

/**
 * A preview no larger than THUMB_SIZE, turned upright from EXIF and stripped of metadata (GPS).
 * HEIC may not decode (libvips is built without HEVC); it is kept without a preview. Any other
 * photo that does not decode is damaged, and refused.
 */
export async function makeThumbnail(buf: Buffer, mime: string, name: string): Promise<Buffer | null> {
  if (!ALLOWED_TYPES[mime]?.image) return null;
  try {
    return await sharp(buf, { failOn: "error" })
      .rotate()
      .resize(THUMB_SIZE, THUMB_SIZE, { fit: "inside", withoutEnlargement: true })
      .jpeg({ quality: 78 })
      .toBuffer();
  } catch {
    if (mime === "image/heic" || mime === "image/heif") return null;
    throw new AppError(
      "unsupported_media",
      `"${name}" could not be read as a picture; it may be damaged. Take the photo again.`,
    );
  }
}

/**
 * A file name safe to store and to echo in Content-Disposition: no path, no control characters, in
 * the stored text form (lib/schemas/canonical-text.ts), cut at 200 characters, never inside one.
 */
export function cleanFileName(raw: string | undefined, fallback: string): string {
  const base = (raw ?? "").split(/[\\/]/).pop() ?? "";
  const clean = canonicalText(base.toWellFormed())
    // eslint-disable-next-line no-control-regex -- control characters are exactly what is removed
    .replace(/[\u0000-\u001f\u007f-\u009f"]/g, "")
    .trim();
  return [...clean].slice(0, 200).join("").trim() || fallback;
}
