import { AppError } from "@/lib/server/core/errors";
import { mailAttachment } from "@/lib/server/mail/files";
import { authed } from "@/lib/server/core/route";

// An attachment (the build record PDF) of a message in the development mailbox; admin only.
export const GET = authed<{ file: string; index: string }>(["admin"], async ({ actor, params }) => {
  const index = Number(params.index);
  if (!Number.isInteger(index) || index < 0) throw new AppError("not_found", "Attachment not found");
  const a = await mailAttachment(actor.shopId, params.file, index);
  const name = a.filename.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return new Response(new Uint8Array(a.content), {
    headers: {
      "content-type": a.contentType,
      "content-length": String(a.content.length),
      "content-disposition": `inline; filename="${name}"`,
      "x-content-type-options": "nosniff",
      "cache-control": "private, no-store",
    },
  });
});
