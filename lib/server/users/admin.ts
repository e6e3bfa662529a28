import "server-only";
import { randomInt } from "node:crypto";
import type { Transaction } from "sequelize";
import type { AdminUser, InviteUserInput, UpdateUserInput } from "@/lib/schemas/user";
import type { Actor } from "@/lib/schemas/session";
import { enqueueAccountMail } from "@/lib/server/accounts/link-mail";
import { recordAudit } from "@/lib/server/log/repo";
import { hashPassword, unusableHash } from "@/lib/server/passwords/hash";
import { endUserSessionRows } from "@/lib/server/sessions/repo";
import { getSequelize } from "@/lib/server/core/db";
import { AppError, notFound } from "@/lib/server/core/errors";
import { liftSignInLocks } from "@/lib/server/users/sign-in";
import {
  createAccount,
  findAccountByEmail,
  listAccounts,
  lockAccount,
  lockActiveAdmins,
  setPassword,
  updateAccount,
  type AccountRow,
} from "@/lib/server/users/repo";

// The admin's account work: invite (an e-mailed link where the person chooses their password),
// change role, deactivate/reactivate, reset a password (the last three end the person's open
// sessions; a reset password is temporary and must be changed at the next sign-in).
// Rules a shop expects: nobody changes their own role or switches their own account off, and
// the shop always keeps one active admin. Passwords and hashes never reach the audit trail.

// No 0/O, 1/l/I: the admin reads the password out or copies it by hand.
const ALPHABET = "abcdefghjkmnpqrstuvwxyz23456789";

/** A one-time password shown once, e.g. "kx7m-4qpr-9tzd" (about 74 bits). */
export function temporaryPassword(): string {
  const group = () => Array.from({ length: 5 }, () => ALPHABET[randomInt(ALPHABET.length)]).join("");
  return [group(), group(), group()].join("-");
}

function toAdminUser(u: AccountRow): AdminUser {
  return {
    id: u.id,
    name: u.name,
    email: u.email,
    role: u.role,
    active: u.active,
    lastSignInAt: u.lastSignInAt ? u.lastSignInAt.toISOString() : null,
    createdAt: u.createdAt.toISOString(),
  };
}

// What the audit keeps of an account: who and what, never the password.
const auditView = (u: AccountRow) => ({ name: u.name, email: u.email, role: u.role, active: u.active });

export async function listShopUsers(shopId: number): Promise<AdminUser[]> {
  return (await listAccounts(shopId)).map(toAdminUser);
}

/**
 * Creates the account with a password nobody knows and queues the invitation in the same
 * transaction; the person chooses their password from the link in it.
 */
export async function inviteUser(actor: Actor, input: InviteUserInput) {
  const passwordHash = await unusableHash();
  return getSequelize().transaction(async (t) => {
    const taken = await findAccountByEmail(t, actor.shopId, input.email);
    if (taken) {
      throw new AppError(
        "conflict",
        `${input.email} already has an account in this shop` +
          (taken.active ? "" : " (deactivated: reactivate it instead)"),
        {
          email: ["This e-mail already has an account"],
        },
      );
    }
    const user = await createAccount(t, {
      shopId: actor.shopId,
      name: input.name,
      email: input.email,
      role: input.role,
      passwordHash,
    });
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "user.invited",
      entityType: "user",
      entityId: user.id,
      after: auditView(user),
    });
    await enqueueAccountMail(t, "invitation", { userId: user.id, shopId: actor.shopId });
    return { user: toAdminUser(user), invitationSentTo: user.email };
  });
}

/** Sends the invitation again, with a new link (the earlier one stops working); only before the first sign-in. */
export async function resendInvitation(actor: Actor, userId: number) {
  return getSequelize().transaction(async (t) => {
    const user = await lockedUser(actor, userId, t);
    if (!user.active) throw new AppError("conflict", `${user.name}'s account is deactivated; reactivate it first`);
    if (user.lastSignInAt)
      throw new AppError(
        "conflict",
        `${user.name} has already signed in. If they forgot their password, they can ask for a reset link ` +
          "on the sign-in screen, or you can reset it here.",
      );
    await enqueueAccountMail(t, "invitation", { userId: user.id, shopId: actor.shopId });
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "user.invitation_resent",
      entityType: "user",
      entityId: user.id,
      after: auditView(user),
    });
    return { user: toAdminUser(user), invitationSentTo: user.email };
  });
}

async function lockedUser(actor: Actor, userId: number, t: Transaction): Promise<AccountRow> {
  const user = await lockAccount(t, actor.shopId, userId);
  if (!user) throw notFound("User");
  return user;
}

function checkRules(actor: Actor, user: AccountRow, change: UpdateUserInput, admins: number[]): void {
  const demoted = change.role !== undefined && change.role !== "admin";
  const losesAdmin = user.role === "admin" && user.active && (demoted || change.active === false);
  if (losesAdmin && admins.every((id) => id === user.id)) {
    throw new AppError("conflict", `${user.name} is the shop's last active admin; make someone else an admin first`);
  }
  if (user.id !== actor.userId) return;
  if (change.role !== undefined && change.role !== user.role) {
    throw new AppError("forbidden", "You cannot change your own role; another admin has to do it");
  }
  if (change.active === false) {
    throw new AppError("conflict", "You cannot deactivate your own account; another admin has to do it");
  }
}

/**
 * A new role or a switched-off account ends every session the person has open, so nobody keeps
 * working under the old rights: they sign in again (or not at all). Answers how many ended.
 */
async function endSessionsFor(t: Transaction, user: AccountRow, change: UpdateUserInput): Promise<number> {
  if (change.active === false && user.active) return endUserSessionRows(t, user.id, "deactivated");
  if (change.role !== undefined && change.role !== user.role) return endUserSessionRows(t, user.id, "role_changed");
  return 0;
}

export async function updateUser(actor: Actor, userId: number, change: UpdateUserInput): Promise<AdminUser> {
  return getSequelize().transaction(async (t) => {
    const admins = await lockActiveAdmins(t, actor.shopId);
    const user = await lockedUser(actor, userId, t);
    checkRules(actor, user, change, admins);
    const before = auditView(user);
    const actions: string[] = [];
    if (change.role !== undefined && change.role !== user.role) actions.push("user.role_changed");
    if (change.active !== undefined && change.active !== user.active)
      actions.push(change.active ? "user.reactivated" : "user.deactivated");
    if (!actions.length) return toAdminUser(user);
    const fields = {
      ...(change.role !== undefined ? { role: change.role } : {}),
      ...(change.active !== undefined ? { active: change.active } : {}),
    };
    await updateAccount(t, user.id, fields);
    const sessionsEnded = await endSessionsFor(t, user, change);
    const after = { ...user, ...fields };
    for (const action of actions) {
      await recordAudit(t, {
        shopId: actor.shopId,
        userId: actor.userId,
        action,
        entityType: "user",
        entityId: user.id,
        before,
        after: { ...auditView(after), ...(sessionsEnded ? { sessionsEnded } : {}) },
      });
    }
    return toAdminUser(after);
  });
}

/**
 * A new temporary password, shown once to the admin; the person must choose their own at the next
 * sign-in. Also lifts a sign-in lock so they can get in with it.
 */
export async function resetPassword(actor: Actor, userId: number) {
  const password = temporaryPassword();
  const passwordHash = await hashPassword(password);
  return getSequelize().transaction(async (t) => {
    const user = await lockedUser(actor, userId, t);
    if (!user.active)
      throw new AppError(
        "conflict",
        `${user.name}'s account is deactivated; reactivate it before resetting the password`,
      );
    // Someone else's temporary password was read out or copied: they choose their own at once. An
    // admin resetting their own is the only one who saw it, and may change it on the account screen.
    await setPassword(t, user.id, passwordHash, { mustChange: user.id !== actor.userId });
    await liftSignInLocks(user.email, t);
    // Whoever knew the old password may be signed in with it: their sessions end (an admin resetting
    // their own keeps the one they are using).
    const keep = user.id === actor.userId ? actor.sessionId : undefined;
    const sessionsEnded = await endUserSessionRows(t, user.id, "password_reset", keep);
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "user.password_reset",
      entityType: "user",
      entityId: user.id,
      before: auditView(user),
      after: { ...auditView(user), passwordReset: true, sessionsEnded },
    });
    return { user: toAdminUser(user), temporaryPassword: password };
  });
}
