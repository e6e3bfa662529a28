// The mail feature's shared words: what kinds of message the outbox holds, and what the admin's
// mail page shows of the outbox and of the development mailbox.

export const MAIL_KINDS = [
  "build_record",
  "record_voided",
  "flag_digest",
  "ready_for_release",
  "shop_verification",
  "shop_address_taken",
  "invitation",
  "password_reset",
] as const;
export type MailKind = (typeof MAIL_KINDS)[number];

/** A message of the outbox as the admin's mail page shows it (GET /api/mail/outbox: times as ISO text). */
export type OutboxMessage = {
  id: number;
  shopId: number;
  kind: MailKind;
  toAddress: string;
  subject: string;
  attempts: number;
  lastError: string | null;
  nextAttemptAt: Date;
  sentAt: Date | null;
  createdAt: Date;
};

export type MailAttachmentInfo = { index: number; filename: string; contentType: string; size: number };

/** A message the local fake SMTP server saved (the development mailbox). */
export type MailFile = {
  file: string;
  to: string;
  subject: string;
  date: string | null;
  kind: string | null;
  attachments: MailAttachmentInfo[];
  text: string;
};
