import "server-only";
import { randomUUID } from "node:crypto";
import type { Transaction } from "sequelize";
import { enqueueMail, type OutboxRow } from "@/lib/server/mail/repo";
import { textToHtml, type OutgoingMail } from "@/lib/server/mail/send";
import { issueToken, tokenLink } from "@/lib/server/tokens/service";
import { findPerson, findShop } from "./repo";

// The message that confirms a new shop's e-mail address. The outbox row names only the person; the
// one-time link (purpose verify_email) is made when the message is sent, so no usable link sits in
// the database, and each message sent again carries a fresh link (the older one stops working).

export const SHOP_MAIL_KIND = "shop_verification";
/** The page the link opens, with the token as its last segment. */
export const CONFIRM_PAGE = "/start/confirm";

const when = (d: Date) => `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;

/** Queues the message in the caller's transaction; answers its dedupe key (to send it at once). */
export async function enqueueShopVerification(
  t: Transaction | null,
  who: { userId: number; shopId: number; email: string; shopName: string },
): Promise<string> {
  const dedupeKey = `${SHOP_MAIL_KIND}:${who.userId}:${randomUUID()}`;
  await enqueueMail(t, {
    shopId: who.shopId,
    kind: SHOP_MAIL_KIND,
    to: who.email,
    dedupeKey,
    subject: `Confirm your e-mail to open ${who.shopName} in Tenthwise`,
    payload: { userId: who.userId },
  });
  return dedupeKey;
}

export async function composeShopVerification(row: OutboxRow): Promise<OutgoingMail> {
  const userId = Number(row.payload.userId);
  const [person, shop] = await Promise.all([findPerson(userId, row.shopId), findShop(row.shopId)]);
  if (!person || !shop) throw new Error(`Outbox message ${row.id}: the shop or its admin is gone`);
  const { token, expiresAt } = await issueToken({ purpose: "verify_email", userId, shopId: row.shopId });
  const text = [
    `Hello ${person.name},`,
    `You asked to start ${shop.name} in Tenthwise, with this address as its first admin.`,
    `Confirm the address and open the shop here (the link works once, until ${when(expiresAt)}):\n` +
      tokenLink(CONFIRM_PAGE, token),
    "Until the address is confirmed nobody can sign in to the shop. If the link has run out, sign in with " +
      "this address and your password, or ask for a new link on the page you started from.",
    "If you did not ask for this, ignore this message: the shop stays closed and nothing else happens.",
  ].join("\n\n");
  return { to: row.toAddress, subject: row.subject, text, html: textToHtml(text) };
}

export const TAKEN_MAIL_KIND = "shop_address_taken";

/**
 * Someone asked to start a shop with an address that already has an account. The page answers as
 * it would for a new shop (so it cannot be used to find who has an account); the address's owner
 * learns of it here instead.
 */
export async function enqueueAddressTaken(who: { shopId: number; email: string; shopName: string }) {
  const dedupeKey = `${TAKEN_MAIL_KIND}:${randomUUID()}`;
  const text = [
    "Hello,",
    `Someone asked to start a shop named "${who.shopName}" in Tenthwise with this address as its first admin. ` +
      "This address already has a Tenthwise account, so no shop was made.",
    'If it was you: sign in with this address as usual (or use "Forgot your password?" on the sign-in page), ' +
      "or start the new shop with another address.",
    "If it was not you, ignore this message: nothing was changed.",
  ].join("\n\n");
  await enqueueMail(null, {
    shopId: who.shopId,
    kind: TAKEN_MAIL_KIND,
    to: who.email,
    dedupeKey,
    subject: "Someone tried to start a Tenthwise shop with your address",
    payload: { text },
  });
  return dedupeKey;
}
