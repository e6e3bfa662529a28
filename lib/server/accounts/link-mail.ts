import "server-only";
import type { Transaction } from "sequelize";
import type { LinkPurpose } from "@/lib/schemas/enums";
import type { OutboxRow } from "@/lib/server/mail/repo";
import { enqueueMail } from "@/lib/server/mail/repo";
import { textToHtml, type OutgoingMail } from "@/lib/server/mail/send";
import { issueToken, tokenLink } from "@/lib/server/tokens/service";
import { findLinkAccount, type LinkAccount } from "./repo";

// The messages that carry a one-time link to set a password: an invitation and a reset. The row
// in the outbox names only the person; the link is made when the message is sent, so no usable
// link sits in the database, and a message sent again carries a fresh link (the older one stops).

export const ACCOUNT_MAIL_KINDS = ["invitation", "password_reset"] as const;
export type AccountMailKind = (typeof ACCOUNT_MAIL_KINDS)[number];

const PURPOSE: Record<AccountMailKind, LinkPurpose> = { invitation: "set_password", password_reset: "reset_password" };

/** The page each link opens, with the token as its last segment. */
export const LINK_PAGES: Record<AccountMailKind, string> = {
  invitation: "/set-password",
  password_reset: "/reset-password",
};

export const isAccountMail = (kind: string): kind is AccountMailKind =>
  (ACCOUNT_MAIL_KINDS as readonly string[]).includes(kind);

const when = (d: Date) => `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;

function invitationText(a: LinkAccount, link: string, expires: Date): string {
  return [
    `Hello ${a.name},`,
    `${a.shopName} has made you an account in Tenthwise, where the shop keeps its bench measurements ` +
      "and build records. You sign in with this e-mail address and a password you choose yourself.",
    `Choose your password here (the link works once, until ${when(expires)}):\n${link}`,
    "If the link has run out, ask your shop's admin to send the invitation again. " +
      "If you did not expect this message, you can ignore it: nothing happens until the link is used.",
  ].join("\n\n");
}

function resetText(a: LinkAccount, link: string, expires: Date): string {
  return [
    `Hello ${a.name},`,
    `Someone asked for a new password for your Tenthwise account at ${a.shopName}.`,
    `Choose a new password here (the link works once, until ${when(expires)}):\n${link}`,
    "Choosing a new password signs you out on every device. If you did not ask for this, ignore this " +
      "message: your password stays as it is.",
  ].join("\n\n");
}

const SUBJECT: Record<AccountMailKind, (a: LinkAccount) => string> = {
  invitation: (a) => `Your Tenthwise account at ${a.shopName}`,
  password_reset: (a) => `New password for Tenthwise at ${a.shopName}`,
};

/** Queues the message in the caller's transaction; false when the account is gone or switched off. */
export async function enqueueAccountMail(
  t: Transaction | null,
  kind: AccountMailKind,
  who: { userId: number; shopId: number },
): Promise<boolean> {
  const account = await findLinkAccount(who.userId, who.shopId, t ?? undefined);
  if (!account?.active) return false;
  return enqueueMail(t, {
    shopId: account.shopId,
    kind,
    to: account.email,
    subject: SUBJECT[kind](account),
    payload: { userId: account.id },
  });
}

/** The message, with a new one-time link (issued now, so its lifetime starts when it is sent). */
export async function composeAccountMail(row: OutboxRow & { kind: AccountMailKind }): Promise<OutgoingMail> {
  const account = await findLinkAccount(Number(row.payload.userId), row.shopId);
  if (!account?.active)
    throw new Error("The account was deactivated or removed after this message was queued, so no link was sent");
  const purpose = PURPOSE[row.kind];
  const { token, expiresAt } = await issueToken({ purpose, userId: account.id, shopId: account.shopId });
  const link = tokenLink(LINK_PAGES[row.kind], token);
  const text =
    row.kind === "invitation" ? invitationText(account, link, expiresAt) : resetText(account, link, expiresAt);
  return { to: row.toAddress, subject: row.subject, text, html: textToHtml(text) };
}
