import "server-only";
import { AppError } from "@/lib/server/core/errors";
import { getObjectStream } from "@/lib/server/uploads/storage";
import type { StoredAttachment } from "@/lib/server/uploads/repo";

// Streams a stored file back. The type is the one we sniffed at upload; nosniff stops a browser
// from second-guessing it, and the name is quoted and encoded so it cannot break the header.
export async function streamAttachment(a: StoredAttachment, which: "file" | "thumb"): Promise<Response> {
  const key = which === "thumb" ? a.thumbKey : a.objectKey;
  if (!key) throw new AppError("not_found", "This file has no preview; open the file itself");
  const obj = await getObjectStream(key);
  if (!obj) throw new AppError("not_found", "The stored file is missing from storage; upload it again");
  const name = which === "thumb" ? `${a.originalName.replace(/\.[^.]*$/, "")}-preview.jpg` : a.originalName;
  const ascii = name.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  const headers: Record<string, string> = {
    "content-type": which === "thumb" ? "image/jpeg" : a.contentType,
    "content-disposition": `inline; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(name)}`,
    "x-content-type-options": "nosniff",
    "cache-control": "private, max-age=3600",
  };
  if (obj.length !== undefined) headers["content-length"] = String(obj.length);
  return new Response(obj.stream, { status: 200, headers });
}
