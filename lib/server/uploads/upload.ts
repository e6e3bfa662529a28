import "server-only";
import { randomUUID } from "node:crypto";
import { UniqueConstraintError } from "sequelize";
import { uploadFieldsSchema, type AttachmentView, type UploadFields } from "@/lib/schemas/attachment";
import { BENCH_ROLES } from "@/lib/schemas/enums";
import type { Actor } from "@/lib/schemas/session";
import { recordAudit } from "@/lib/server/log/repo";
import { getSequelize } from "@/lib/server/core/db";
import { env } from "@/lib/server/core/env";
import { AppError, invalid } from "@/lib/server/core/errors";
import { deleteObject, putObject } from "@/lib/server/uploads/storage";
import { cleanFileName, makeThumbnail, sniffType, tooLarge } from "@/lib/server/uploads/content";
import {
  findByClientId,
  findOwnerOrThrow,
  insertAttachment,
  linkCertificate,
  refuseLocked,
  toView,
  type StoredAttachment,
} from "@/lib/server/uploads/repo";

// POST /api/attachments: one file with its owner. A resend with the same clientId (the tablet
// retrying a photo taken offline) returns the attachment already stored, never a duplicate. The
// clientId is looked up in the actor's shop only, and the stored file gets an id of the server's:
// a clientId another shop has used is answered like a fresh one and tells nothing of that shop.
const UPLOAD_ROLES = { job: BENCH_ROLES, reading: BENCH_ROLES, instrument: ["admin"] } as const;
// Room for the multipart boundaries and the text fields around the file.
const MULTIPART_SLACK = 64 * 1024;

export type UploadResult = { attachment: AttachmentView; created: boolean };

async function readForm(req: Request, max: number): Promise<{ fields: UploadFields; file: File }> {
  const declared = Number(req.headers.get("content-length") ?? NaN);
  if (Number.isFinite(declared) && declared > max + MULTIPART_SLACK) throw tooLarge(null, max);
  let form: FormData;
  try {
    form = await req.formData();
  } catch {
    throw new AppError(
      "bad_request",
      "Send the upload as multipart/form-data with the fields file, ownerType, ownerId and clientId",
    );
  }
  const parsed = uploadFieldsSchema.safeParse({
    ownerType: form.get("ownerType"),
    ownerId: form.get("ownerId"),
    clientId: form.get("clientId"),
  });
  const file = form.get("file");
  if (!parsed.success) throw invalid(parsed.error);
  if (!(file instanceof File) || file.size === 0) {
    throw new AppError("invalid", "Choose a file to upload", {
      file: ["Attach the photo or PDF as the field 'file'; it was missing or empty"],
    });
  }
  return { fields: parsed.data, file };
}

function checkRole(actor: Actor, fields: UploadFields): void {
  const allowed: readonly string[] = UPLOAD_ROLES[fields.ownerType];
  if (!allowed.includes(actor.role)) {
    const what =
      fields.ownerType === "instrument"
        ? "Gauge certificates are uploaded by the shop admin"
        : "Job and reading photos are added by a machinist or the lead";
    throw new AppError("forbidden", what);
  }
}

/** The shop's earlier upload with this clientId, when it is for the same owner. */
function sameUpload(existing: StoredAttachment, fields: UploadFields): AttachmentView {
  const sameOwner = existing.ownerType === fields.ownerType && existing.ownerId === fields.ownerId;
  if (!sameOwner) {
    throw new AppError("conflict", "This clientId was already used for another file; make a new UUID for each file");
  }
  return toView(existing);
}

async function store(actor: Actor, fields: UploadFields, file: File, buf: Buffer, mime: string, thumb: Buffer | null) {
  const key = `${actor.shopId}/${randomUUID()}`;
  const thumbKey = thumb ? `${key}-thumb.jpg` : null;
  await putObject(key, buf, mime);
  if (thumb && thumbKey) await putObject(thumbKey, thumb, "image/jpeg");
  const row = {
    id: randomUUID(),
    shopId: actor.shopId,
    clientId: fields.clientId,
    ownerType: fields.ownerType,
    ownerId: fields.ownerId,
    objectKey: key,
    thumbKey,
    contentType: mime,
    sizeBytes: buf.length,
    originalName: cleanFileName(file.name, `upload-${fields.clientId.slice(0, 8)}`),
    uploadedBy: actor.userId,
  };
  try {
    return await getSequelize().transaction(async (t) => {
      const saved = await insertAttachment(t, row);
      await recordAudit(t, {
        shopId: actor.shopId,
        userId: actor.userId,
        action: "attachment.create",
        entityType: "attachment",
        entityId: saved.id,
        after: toView(saved),
      });
      if (fields.ownerType === "instrument") {
        const link = await linkCertificate(t, actor.shopId, Number(fields.ownerId), saved.id);
        await recordAudit(t, {
          shopId: actor.shopId,
          userId: actor.userId,
          action: "instrument.certificate",
          entityType: "instrument",
          entityId: fields.ownerId,
          before: { certificateAttachmentId: link.before },
          after: { certificateAttachmentId: link.after },
        });
      }
      return { attachment: toView(saved), created: true };
    });
  } catch (err) {
    // Two sends of the same photo raced; the other one won. Drop our copy, return theirs.
    await Promise.allSettled([deleteObject(key), ...(thumbKey ? [deleteObject(thumbKey)] : [])]);
    const existing = err instanceof UniqueConstraintError ? await findByClientId(actor.shopId, fields.clientId) : null;
    if (existing) return { attachment: sameUpload(existing, fields), created: false };
    throw err;
  }
}

export async function acceptUpload(actor: Actor, req: Request): Promise<UploadResult> {
  const max = env().UPLOAD_MAX_BYTES;
  const { fields, file } = await readForm(req, max);
  checkRole(actor, fields);
  const existing = await findByClientId(actor.shopId, fields.clientId);
  if (existing) return { attachment: sameUpload(existing, fields), created: false };
  const owner = await findOwnerOrThrow(actor.shopId, fields.ownerType, fields.ownerId);
  refuseLocked(owner);
  if (file.size > max) throw tooLarge(file.size, max);
  const buf = Buffer.from(await file.arrayBuffer());
  const name = cleanFileName(file.name, "The file");
  const mime = await sniffType(buf, name);
  const thumb = await makeThumbnail(buf, mime, name);
  return store(actor, fields, file, buf, mime, thumb);
}
