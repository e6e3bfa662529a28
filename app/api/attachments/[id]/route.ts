import { authed } from "@/lib/server/core/route";
import { getAttachmentOrThrow } from "@/lib/server/uploads/repo";
import { streamAttachment } from "@/lib/server/uploads/serve";

// The stored file, streamed from object storage; 404 for another shop's.
export const GET = authed<{ id: string }>(["lead", "inspector", "admin"], async ({ actor, params }) => {
  return streamAttachment(await getAttachmentOrThrow(actor.shopId, params.id), "file");
});
