import "server-only";
import { checkCustomerToken, createCustomerToken, customerLinkUrl } from "@/lib/server/release/customer-link";
import { textToHtml, type OutgoingMail } from "@/lib/server/mail/send";
import { composeAccountMail, isAccountMail } from "@/lib/server/accounts/link-mail";
import type { OutboxRow } from "@/lib/server/mail/repo";
import { day } from "@/lib/server/record/format";
import { loadBuildRecord } from "@/lib/server/record/data";
import { recordFile } from "@/lib/server/record/stored";
import type { BuildRecord } from "@/lib/schemas/record";
import { composeShopVerification, SHOP_MAIL_KIND } from "@/lib/server/shops/verify-mail";

// Turns an outbox row into the message that goes out. The build record attached is the file kept
// for the release (lib/server/record/stored.ts), and its customer link is made when it is sent,
// so the link's lifetime starts when the customer receives it. Digests and "ready" notes are
// written when queued.

function recordText(record: BuildRecord, link: string, expires: Date): string {
  const r = record.release!;
  const contact = record.shop.contact.length ? ` (${record.shop.contact.join(", ")})` : "";
  return [
    `Hello ${record.customer.name || "there"},`,
    `${record.shop.name} has signed off the build record of your engine: ` +
      `job ${record.job.code}, ${record.job.title}. ` +
      `It was released for assembly by ${r.inspectorName} on ${r.signedAt}.`,
    "The record is attached as a PDF: every measurement with its limits and verdict, the decisions on anything " +
      "outside the limits, the torque records and the signature.",
    `You can also view and download it here, without an account (the link works until ${day(expires)}):\n${link}`,
    `The record's fingerprint is ${r.hash}. ` +
      `Anyone can check that the shop's record still matches it at:\n${r.verifyUrl}`,
    `Safety: ${record.safety[0]} ${record.safety[2]}`,
    `Questions about the record go to ${record.shop.name}${contact}.`,
  ].join("\n\n");
}

async function composeBuildRecord(row: OutboxRow): Promise<OutgoingMail> {
  const jobId = Number(row.payload.jobId);
  const releaseId = Number(row.payload.releaseId);
  // The words come from the record now; the attachment is the file kept for the release.
  const [record, { pdf, fileName }] = await Promise.all([
    loadBuildRecord(row.shopId, jobId, { releaseId }),
    recordFile(row.shopId, jobId, { releaseId }),
  ]);
  const token = createCustomerToken(releaseId);
  const check = checkCustomerToken(token);
  const expires = check.ok ? check.expiresAt : new Date();
  const text = recordText(record, customerLinkUrl(token), expires);
  const voided = record.release?.status === "void" ? "[VOID] " : "";
  return {
    to: row.toAddress,
    subject: `${voided}${row.subject}`,
    text,
    html: textToHtml(text),
    attachments: [{ filename: fileName, content: pdf, contentType: "application/pdf" }],
  };
}

export async function composeMail(row: OutboxRow): Promise<OutgoingMail> {
  const kind = row.kind;
  const base =
    kind === "build_record"
      ? await composeBuildRecord(row)
      : kind === SHOP_MAIL_KIND
        ? await composeShopVerification(row)
        : isAccountMail(kind)
          ? await composeAccountMail({ ...row, kind })
          : composeWritten(row);
  return {
    ...base,
    headers: {
      "X-Tenthwise-Shop": String(row.shopId),
      "X-Tenthwise-Kind": row.kind,
      "X-Tenthwise-Outbox-Id": String(row.id),
    },
  };
}

function composeWritten(row: OutboxRow): OutgoingMail {
  const text = typeof row.payload.text === "string" ? row.payload.text : "";
  if (!text) throw new Error(`Outbox message ${row.id} (${row.kind}) has no text to send`);
  return { to: row.toAddress, subject: row.subject, text, html: textToHtml(text) };
}
