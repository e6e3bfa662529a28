import "server-only";
import type { ShopSignUpInput } from "@/lib/schemas/shop";
import { getSequelize } from "@/lib/server/core/db";
import { env } from "@/lib/server/core/env";
import { AppError } from "@/lib/server/core/errors";
import { recordAudit } from "@/lib/server/log/repo";
import { deliverPendingMail } from "@/lib/server/mail/outbox-worker";
import { hashPassword } from "@/lib/server/passwords/hash";
import { assertPasswordAllowed } from "@/lib/server/passwords/policy";
import { consumeToken } from "@/lib/server/tokens/service";
import { createShop } from "./create-shop";
import { accountOf, activateShop, findPendingAdmin, findShop, outboxIdByKey } from "./repo";
import { enqueueAddressTaken, enqueueShopVerification } from "./verify-mail";

// The public way to start a shop: the shop, its first admin and its starter sheets are made at
// once, but the shop stays closed (nobody signs in) until the admin opens the e-mailed link.

export const SIGN_UP_CLOSED =
  "This Tenthwise does not take new shops from the public page. Ask whoever runs it to make your shop.";

export const publicSignUpOpen = () => env().PUBLIC_SIGNUP === "on";

function assertSignUpOpen() {
  if (!publicSignUpOpen()) throw new AppError("forbidden", SIGN_UP_CLOSED);
}

/** Sends the queued message now rather than at the worker's next pass; a failure is left to its retries. */
async function sendNow(dedupeKey: string): Promise<void> {
  const id = await outboxIdByKey(dedupeKey);
  if (id) await deliverPendingMail({ only: [id], budgetMs: 10_000 }).catch(() => undefined);
}

export async function startShop(input: ShopSignUpInput): Promise<{ email: string }> {
  assertSignUpOpen();
  assertPasswordAllowed(input.password, { email: input.email, name: input.adminName }, "password");
  const passwordHash = await hashPassword(input.password);
  // An address that already has an account gets the same answer as a new one; its owner is told by mail.
  const existing = await accountOf(input.email);
  if (existing) {
    await sendNow(await enqueueAddressTaken({ shopId: existing.shopId, email: input.email, shopName: input.shopName }));
    return { email: input.email };
  }
  const { shopId, adminId } = await createShop({ ...input, passwordHash, activatedAt: null, via: "sign_up" });
  const key = await enqueueShopVerification(null, {
    userId: adminId,
    shopId,
    email: input.email,
    shopName: input.shopName,
  });
  await sendNow(key);
  return { email: input.email };
}

/** Opens the shop named by the link; answers who to sign in. A used or expired link says so (410). */
export async function confirmShop(token: string): Promise<{ userId: number; shopId: number; shopName: string }> {
  return getSequelize().transaction(async (t) => {
    const owner = await consumeToken("verify_email", token, t);
    const shop = await findShop(owner.shopId, t);
    if (!shop) throw new AppError("not_found", "That shop no longer exists");
    if (await activateShop(t, shop.id, new Date()))
      await recordAudit(t, {
        shopId: shop.id,
        userId: owner.userId,
        action: "shop.activate",
        entityType: "shop",
        entityId: shop.id,
        after: { activated: true },
      });
    return { ...owner, shopName: shop.name };
  });
}

/**
 * A new confirmation link for a shop still waiting. Answers the same whether or not the address
 * belongs to one, so the page cannot be used to find out who has started a shop.
 */
export async function resendShopLink(email: string): Promise<void> {
  assertSignUpOpen();
  const pending = await findPendingAdmin(email);
  if (!pending) return;
  await sendNow(await enqueueShopVerification(null, pending));
}

/** Sign-in with the right password to a shop not yet confirmed: a new link goes out, and the words say so. */
export async function assertShopOpen(user: { id: number; shopId: number; email: string }): Promise<void> {
  const shop = await findShop(user.shopId);
  if (!shop || shop.activatedAt) return;
  await sendNow(
    await enqueueShopVerification(null, { userId: user.id, shopId: shop.id, email: user.email, shopName: shop.name }),
  );
  throw new AppError(
    "forbidden",
    `${shop.name} opens once you confirm your e-mail address. We have sent a new link to ${user.email}; ` +
      "open it, then sign in.",
  );
}
