import { authed } from "@/lib/server/core/route";
import { getAttachmentOrThrow } from "@/lib/server/uploads/repo";
import { streamAttachment } from "@/lib/server/uploads/serve";

// The JPEG preview of a photo (404 for a PDF or a photo without one, and for another shop's).
export const GET = authed<{ id: string }>(["lead", "inspector", "admin"], async ({ actor, params }) => {
  return streamAttachment(await getAttachmentOrThrow(actor.shopId, params.id), "thumb");
});
