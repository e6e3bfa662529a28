import { Readable } from "node:stream";
import { AppError } from "@/lib/server/core/errors";
import { authed } from "@/lib/server/core/route";
import { findArchiveShop, recordArchiveDownload } from "@/lib/server/archive/repo";
import { ARCHIVE_FILES, shopArchive } from "@/lib/server/archive/stream";

/** The admin's whole shop as one zip of CSV and JSON (format: docs/archive-format.md), streamed. */
export const GET = authed(["admin"], async ({ actor }) => {
  const shop = await findArchiveShop(actor.shopId);
  if (!shop) throw new AppError("not_found", "This shop no longer exists.");
  await recordArchiveDownload(actor.shopId, actor.userId, ARCHIVE_FILES);
  const day = new Date().toISOString().slice(0, 10);
  const name = `tenthwise-${shop.slug.replace(/[^A-Za-z0-9._-]/g, "_")}-${day}.zip`;
  const zip = shopArchive(shop, { id: actor.userId, name: actor.name });
  return new Response(Readable.toWeb(zip) as ReadableStream<Uint8Array>, {
    headers: {
      "Content-Type": "application/zip",
      "Content-Disposition": `attachment; filename="${name}"`,
      "Cache-Control": "no-store",
    },
  });
});
