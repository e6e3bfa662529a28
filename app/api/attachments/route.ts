import { attachmentListSchema } from "@/lib/schemas/attachment";
import { invalid } from "@/lib/server/core/errors";
import { authed } from "@/lib/server/core/route";
import { acceptUpload } from "@/lib/server/uploads/upload";
import { findOwnerOrThrow, listAttachments, toView } from "@/lib/server/uploads/repo";

// POST: multipart upload (file, ownerType, ownerId, clientId). 201 when stored, 200 when the
// same clientId was already stored (an offline resend). Who may upload what: lib/server/uploads/upload.ts.
export const POST = authed(["machinist", "lead", "admin"], async ({ req, actor }) => {
  const { attachment, created } = await acceptUpload(actor, req);
  return Response.json({ attachment, created }, { status: created ? 201 : 200 });
});

// GET ?ownerType=job&ownerId=12: the files of one job, reading or gauge.
export const GET = authed(["lead", "inspector", "admin"], async ({ req, actor }) => {
  const q = new URL(req.url).searchParams;
  const parsed = attachmentListSchema.safeParse({ ownerType: q.get("ownerType"), ownerId: q.get("ownerId") });
  if (!parsed.success) throw invalid(parsed.error);
  await findOwnerOrThrow(actor.shopId, parsed.data.ownerType, parsed.data.ownerId);
  const rows = await listAttachments(actor.shopId, parsed.data.ownerType, [parsed.data.ownerId]);
  return { attachments: rows.map(toView) };
});
