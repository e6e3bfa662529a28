import "server-only";
import type { Transaction } from "sequelize";
import { models } from "@/lib/server/core/db";

// A person's own account: what an e-mailed link or the account screen needs of it, and setting
// the password they chose. Plain objects out; password hashes leave only for the comparison.

export type LinkAccount = {
  id: number;
  shopId: number;
  name: string;
  email: string;
  active: boolean;
  neverSignedIn: boolean;
  shopName: string;
};

export async function findLinkAccount(userId: number, shopId: number, t?: Transaction): Promise<LinkAccount | null> {
  const { Shop, User } = models();
  const u = await User.findOne({ where: { id: userId, shopId }, transaction: t });
  const shop = u ? await Shop.findByPk(u.shopId, { transaction: t }) : null;
  if (!u || !shop) return null;
  return {
    id: u.id,
    shopId: u.shopId,
    name: u.name,
    email: u.email,
    active: u.active,
    neverSignedIn: !u.lastSignInAt,
    shopName: shop.name,
  };
}

/** Active accounts with this e-mail, in any shop (an address may belong to people in two shops). */
export async function findActiveAccountsByEmail(email: string): Promise<{ id: number; shopId: number }[]> {
  const { User } = models();
  const rows = await User.findAll({ where: { email, active: true }, attributes: ["id", "shopId"], limit: 10 });
  return rows.map((u) => ({ id: u.id, shopId: u.shopId }));
}

/** The person's row locked for the change, with the hash to compare the current password against. */
export async function lockOwnAccount(t: Transaction, userId: number, shopId: number) {
  const { User } = models();
  const u = await User.findOne({ where: { id: userId, shopId, active: true }, transaction: t, lock: t.LOCK.UPDATE });
  return u ? { id: u.id, name: u.name, email: u.email, passwordHash: u.passwordHash } : null;
}

/** The password the person chose: no change is owed any more, and their failure count and lock go. */
export async function storeChosenPassword(t: Transaction, userId: number, passwordHash: string): Promise<void> {
  const { User } = models();
  await User.update(
    { passwordHash, mustChangePassword: false, failedAttempts: 0, lockedUntil: null },
    { where: { id: userId }, transaction: t },
  );
}
