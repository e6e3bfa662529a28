import { z } from "zod";
import { ATTACHMENT_OWNER_TYPES, type AttachmentOwnerType } from "@/lib/schemas/enums";
import { storedText } from "./stored-text";

// The text fields of an upload (multipart/form-data, next to the `file` part). The clientId is
// the device's own UUID for this file, so a photo taken offline can be sent again safely.
export const uploadFieldsSchema = z.object({
  ownerType: z.enum(ATTACHMENT_OWNER_TYPES, { error: "ownerType must be job, reading or instrument" }),
  ownerId: storedText("ownerId")
    .trim()
    .min(1, "Say which job, reading or gauge the file belongs to (ownerId)")
    .max(36, "ownerId is too long"),
  clientId: z.uuid({ error: "clientId must be a UUID made by the device for this file" }),
});

export type UploadFields = z.infer<typeof uploadFieldsSchema>;

export const attachmentListSchema = z.object({
  ownerType: z.enum(ATTACHMENT_OWNER_TYPES, { error: "ownerType must be job, reading or instrument" }),
  ownerId: storedText("ownerId").trim().min(1, "Give the ownerId").max(36),
});

/** A stored file as the API shows it (no storage keys, no shop id). */
export type AttachmentView = {
  id: string;
  ownerType: AttachmentOwnerType;
  ownerId: string;
  contentType: string;
  sizeBytes: number;
  originalName: string;
  hasThumb: boolean;
  url: string;
  thumbUrl: string | null;
  uploadedBy: number;
  createdAt: string;
};
