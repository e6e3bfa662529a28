import "server-only";
import { isJobLocked, lockedJobWords } from "@/lib/domain";
import type { Transaction } from "sequelize";
import type { Attachment } from "@/models";
import type { AttachmentView } from "@/lib/schemas/attachment";
import type { AttachmentOwnerType } from "@/lib/schemas/enums";
import { models } from "@/lib/server/core/db";
import { AppError, notFound } from "@/lib/server/core/errors";

// Attachment rows, and the ownership checks that keep one shop's files away from another's.
export type StoredAttachment = AttachmentView & {
  shopId: number;
  clientId: string;
  objectKey: string;
  thumbKey: string | null;
};

export function reshapeAttachment(a: Attachment): StoredAttachment {
  return {
    id: a.id,
    shopId: a.shopId,
    clientId: a.clientId,
    ownerType: a.ownerType,
    ownerId: a.ownerId,
    contentType: a.contentType,
    sizeBytes: a.sizeBytes,
    originalName: a.originalName,
    hasThumb: !!a.thumbKey,
    objectKey: a.objectKey,
    thumbKey: a.thumbKey ?? null,
    url: `/api/attachments/${a.id}`,
    thumbUrl: a.thumbKey ? `/api/attachments/${a.id}/thumb` : null,
    uploadedBy: a.uploadedBy,
    createdAt: a.createdAt.toISOString(),
  };
}

/** The public view: no storage keys, no shop id. */
export function toView(a: StoredAttachment): AttachmentView {
  const { shopId: _s, clientId: _c, objectKey: _o, thumbKey: _t, ...view } = a;
  return view;
}

/** Any shop's attachment with this id (the server's own UUID). */
export async function findAttachmentById(id: string, t?: Transaction): Promise<StoredAttachment | null> {
  const { Attachment } = models();
  const a = await Attachment.findByPk(id, { transaction: t });
  return a ? reshapeAttachment(a) : null;
}

/** This shop's attachment sent under the device's `clientId`; another shop's is never seen. */
export async function findByClientId(shopId: number, clientId: string): Promise<StoredAttachment | null> {
  const { Attachment } = models();
  const a = await Attachment.findOne({ where: { shopId, clientId } });
  return a ? reshapeAttachment(a) : null;
}

export async function getAttachmentOrThrow(shopId: number, id: string): Promise<StoredAttachment> {
  const a = /^[0-9a-f-]{36}$/i.test(id) ? await findAttachmentById(id) : null;
  if (!a || a.shopId !== shopId) throw notFound("File");
  return a;
}

export async function listAttachments(
  shopId: number,
  ownerType: AttachmentOwnerType,
  ownerIds: string[],
): Promise<StoredAttachment[]> {
  const { Attachment } = models();
  if (ownerIds.length === 0) return [];
  const rows = await Attachment.findAll({
    where: { shopId, ownerType, ownerId: ownerIds },
    order: [
      ["createdAt", "ASC"],
      ["id", "ASC"],
    ],
  });
  return rows.map(reshapeAttachment);
}

export type OwnerInfo = { jobId: number | null; locked: boolean; jobCode?: string; status?: string };

/** The owner, in this shop; 404 for a missing one or another shop's (never say which). */
export async function findOwnerOrThrow(
  shopId: number,
  ownerType: AttachmentOwnerType,
  ownerId: string,
): Promise<OwnerInfo> {
  const { Instrument, Job, Reading } = models();
  if (ownerType === "instrument") {
    const id = Number(ownerId);
    const gauge = Number.isInteger(id) && id > 0 ? await Instrument.findOne({ where: { id, shopId } }) : null;
    if (!gauge) throw notFound("Gauge");
    return { jobId: null, locked: false };
  }
  let jobId: number | null;
  if (ownerType === "reading") {
    const reading = /^[0-9a-f-]{36}$/i.test(ownerId) ? await Reading.findOne({ where: { id: ownerId, shopId } }) : null;
    if (!reading) throw notFound("Reading");
    jobId = reading.jobId;
  } else {
    const id = Number(ownerId);
    jobId = Number.isInteger(id) && id > 0 ? id : null;
  }
  const job = jobId ? await Job.findOne({ where: { id: jobId, shopId } }) : null;
  if (!job) throw notFound("Job");
  return {
    jobId: job.id,
    jobCode: job.code,
    status: job.status,
    locked: isJobLocked(job),
  };
}

export function refuseLocked(owner: OwnerInfo): void {
  if (!owner.locked) return;
  const job = { code: owner.jobCode, status: owner.status ?? "released", locked: true };
  throw new AppError("job_locked", lockedJobWords(job, "its photos and files")!);
}

export type NewAttachment = Omit<StoredAttachment, "hasThumb" | "url" | "thumbUrl" | "createdAt">;

export async function insertAttachment(t: Transaction, a: NewAttachment): Promise<StoredAttachment> {
  const { Attachment } = models();
  const row = await Attachment.create(
    {
      id: a.id,
      shopId: a.shopId,
      clientId: a.clientId,
      ownerType: a.ownerType,
      ownerId: a.ownerId,
      objectKey: a.objectKey,
      thumbKey: a.thumbKey,
      contentType: a.contentType,
      sizeBytes: a.sizeBytes,
      originalName: a.originalName,
      uploadedBy: a.uploadedBy,
    },
    { transaction: t },
  );
  return reshapeAttachment(row);
}

/** A gauge's calibration certificate is the latest certificate uploaded for it. */
export async function linkCertificate(t: Transaction, shopId: number, instrumentId: number, attachmentId: string) {
  const { Instrument } = models();
  const gauge = await Instrument.findOne({ where: { id: instrumentId, shopId }, transaction: t });
  if (!gauge) throw notFound("Gauge");
  const before = gauge.certificateAttachmentId ?? null;
  await gauge.update({ certificateAttachmentId: attachmentId }, { transaction: t });
  return { before, after: attachmentId };
}
