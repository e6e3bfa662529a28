import "server-only";
import type { Actor } from "@/lib/schemas/session";
import type { ChangePasswordInput, LinkPageState, SetPasswordInput } from "@/lib/schemas/password";
import { getSequelize } from "@/lib/server/core/db";
import { AppError } from "@/lib/server/core/errors";
import { recordAudit } from "@/lib/server/log/repo";
import { hashPassword, passwordMatches } from "@/lib/server/passwords/hash";
import { assertPasswordAllowed } from "@/lib/server/passwords/policy";
import { endUserSessionRows } from "@/lib/server/sessions/repo";
import { checkToken, consumeToken } from "@/lib/server/tokens/service";
import type { AccountMailKind } from "./link-mail";
import { findLinkAccount, lockOwnAccount, storeChosenPassword } from "./repo";

// A person choosing their own password: from an e-mailed link (an invitation or a reset), or on
// their account screen with the current one. Each ends the sessions the old password opened.

const LINK_PURPOSE = { invitation: "set_password", password_reset: "reset_password" } as const;
const LINK_ACTION = { invitation: "user.password_set_from_invitation", password_reset: "user.password_reset_by_link" };

/** Who a link belongs to, for the page that shows its form; throws 410 with words when it cannot be used. */
export async function linkHolder(kind: AccountMailKind, token: string) {
  const owner = await checkToken(LINK_PURPOSE[kind], token);
  const account = await findLinkAccount(owner.userId, owner.shopId);
  if (!account?.active)
    throw new AppError("gone", "This account has been switched off. Ask your shop's admin.", {
      token: ["Account off"],
    });
  return { ...account, expiresAt: owner.expiresAt };
}

/** For the link's page: whose it is, or the words saying why it cannot be used (looking never uses it up). */
export async function linkPageState(kind: AccountMailKind, token: string): Promise<LinkPageState> {
  try {
    const h = await linkHolder(kind, token);
    return { holder: { name: h.name, email: h.email, shopName: h.shopName, expiresAt: h.expiresAt.toISOString() } };
  } catch (err) {
    if (err instanceof AppError) return { problem: err.message };
    throw err;
  }
}

/**
 * Sets the password from a link. The password is checked before the link is used, so a refused
 * password leaves the link working; the link is used up in the same transaction as the new hash.
 */
export async function setPasswordFromLink(kind: AccountMailKind, input: SetPasswordInput): Promise<{ email: string }> {
  const holder = await linkHolder(kind, input.token);
  assertPasswordAllowed(input.password, holder, "password");
  const passwordHash = await hashPassword(input.password);
  return getSequelize().transaction(async (t) => {
    const owner = await consumeToken(LINK_PURPOSE[kind], input.token, t);
    await storeChosenPassword(t, owner.userId, passwordHash);
    const sessionsEnded = await endUserSessionRows(t, owner.userId, "password_reset");
    await recordAudit(t, {
      shopId: owner.shopId,
      userId: owner.userId,
      action: LINK_ACTION[kind],
      entityType: "user",
      entityId: owner.userId,
      after: { name: holder.name, email: holder.email, sessionsEnded },
    });
    return { email: holder.email };
  });
}

export const WRONG_CURRENT_PASSWORD = "That is not your current password. Type the one you signed in with.";

/** Changes one's own password; the other sessions end, the one in use stays signed in. */
export async function changeOwnPassword(actor: Actor, input: ChangePasswordInput): Promise<{ sessionsEnded: number }> {
  assertPasswordAllowed(input.newPassword, actor, "newPassword");
  if (input.newPassword === input.currentPassword) {
    const words = "The new password is the same as the current one. Choose a different one.";
    throw new AppError("invalid", words, { newPassword: [words] });
  }
  const passwordHash = await hashPassword(input.newPassword);
  return getSequelize().transaction(async (t) => {
    const account = await lockOwnAccount(t, actor.userId, actor.shopId);
    if (!account) throw new AppError("unauthorized", "Sign in first");
    if (!(await passwordMatches(input.currentPassword, account.passwordHash)))
      throw new AppError("invalid", WRONG_CURRENT_PASSWORD, { currentPassword: [WRONG_CURRENT_PASSWORD] });
    await storeChosenPassword(t, account.id, passwordHash);
    const sessionsEnded = await endUserSessionRows(t, account.id, "password_changed", actor.sessionId);
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "user.password_changed",
      entityType: "user",
      entityId: actor.userId,
      after: { name: account.name, email: account.email, sessionsEnded },
    });
    return { sessionsEnded };
  });
}

/** Ends every session of the person, this one included; answers how many ended. */
export async function signOutEverywhere(actor: Actor): Promise<number> {
  return getSequelize().transaction(async (t) => {
    const ended = await endUserSessionRows(t, actor.userId, "signed_out_everywhere");
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "user.signed_out_everywhere",
      entityType: "user",
      entityId: actor.userId,
      after: { sessionsEnded: ended },
    });
    return ended;
  });
}
