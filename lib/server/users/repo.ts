import "server-only";
import { Op, type Transaction } from "sequelize";
import type { User } from "@/models";
import { models } from "@/lib/server/core/db";
import { readRows, type Read } from "@/lib/server/core/sql-read";
import type { Role } from "@/lib/schemas/enums";
import type { ShopContact, ShopRecord } from "@/lib/schemas/user";

// Accounts and the shop itself, as plain objects (the sign-in throttle's counters: lib/server/throttle).

export type UserRecord = {
  id: number;
  shopId: number;
  name: string;
  email: string;
  role: Role;
  active: boolean;
  /** A temporary password from an admin: they must choose their own before any other work. */
  mustChangePassword: boolean;
};
/** An account as the admin's pages show it. */
export type AccountRow = UserRecord & { lastSignInAt: Date | null; createdAt: Date };

function reshape(u: User): UserRecord {
  return {
    id: u.id,
    shopId: u.shopId,
    name: u.name,
    email: u.email,
    role: u.role as Role,
    active: u.active,
    mustChangePassword: u.mustChangePassword,
  };
}

const account = (u: User): AccountRow => ({
  ...reshape(u),
  lastSignInAt: u.lastSignInAt ?? null,
  createdAt: u.createdAt,
});

export async function findActiveUser(id: number, shopId: number): Promise<UserRecord | null> {
  const { User } = models();
  const u = await User.findOne({ where: { id, shopId, active: true } });
  return u ? reshape(u) : null;
}

/** Active accounts with this e-mail in any shop (e-mail is unique per shop, not globally). */
export async function findSignInCandidates(email: string) {
  const { User } = models();
  const users = await User.findAll({ where: { email: email.toLowerCase(), active: true }, limit: 10 });
  return users.map((u) => ({ ...reshape(u), passwordHash: u.passwordHash }));
}

/** The name and password hash an e-signature is checked against; null for an inactive account. */
export async function findSigner(
  userId: number,
  shopId: number,
): Promise<{ name: string; passwordHash: string } | null> {
  const { User } = models();
  const u = await User.findOne({ where: { id: userId, shopId, active: true }, attributes: ["name", "passwordHash"] });
  return u ? { name: u.name, passwordHash: u.passwordHash } : null;
}

export async function markSignedIn(id: number) {
  const { User } = models();
  await User.update({ lastSignInAt: new Date() }, { where: { id } });
}

export async function listUsers(shopId: number, opts: { activeOnly?: boolean } = {}) {
  const { User } = models();
  const users = await User.findAll({
    where: { shopId, ...(opts.activeOnly ? { active: true } : {}) },
    order: [["name", "ASC"]],
  });
  return users.map(reshape);
}

/** Each of the shop's people's name by id (the readings CSV's "taken by"), read through the driver. */
export async function peopleNames(shopId: number, read: Read = readRows): Promise<Map<number, string>> {
  const rows = await read<{ id: number; name: string }>("SELECT id, name FROM users WHERE shop_id = ?", [shopId]);
  return new Map(rows.map((r) => [Number(r.id), r.name]));
}

export async function countActiveAdmins(shopId: number, exceptId?: number) {
  const { User } = models();
  return User.count({
    where: { shopId, role: "admin", active: true, ...(exceptId ? { id: { [Op.ne]: exceptId } } : {}) },
  });
}

/** The admin's list: active accounts first, then by name. */
export async function listAccounts(shopId: number): Promise<AccountRow[]> {
  const { User } = models();
  const rows = await User.findAll({
    where: { shopId },
    order: [
      ["active", "DESC"],
      ["name", "ASC"],
    ],
  });
  return rows.map(account);
}

export async function findAccountByEmail(t: Transaction, shopId: number, email: string): Promise<AccountRow | null> {
  const { User } = models();
  const u = await User.findOne({ where: { shopId, email }, transaction: t });
  return u ? account(u) : null;
}

export type NewAccount = { shopId: number; name: string; email: string; role: Role; passwordHash: string };

export async function createAccount(t: Transaction, a: NewAccount): Promise<AccountRow> {
  const { User } = models();
  return account(await User.create(a, { transaction: t }));
}

/** One account of the shop, locked FOR UPDATE inside `t`; null when the shop has no such account. */
export async function lockAccount(t: Transaction, shopId: number, userId: number): Promise<AccountRow | null> {
  const { User } = models();
  const u = await User.findOne({ where: { id: userId, shopId }, transaction: t, lock: t.LOCK.UPDATE });
  return u ? account(u) : null;
}

/**
 * Locks the shop's active admins (in id order, before the target row, so two admins changing each
 * other wait in turn instead of deadlocking) and returns their ids.
 */
export async function lockActiveAdmins(t: Transaction, shopId: number): Promise<number[]> {
  const { User } = models();
  const admins = await User.findAll({
    where: { shopId, role: "admin", active: true },
    order: [["id", "ASC"]],
    transaction: t,
    lock: t.LOCK.UPDATE,
  });
  return admins.map((a) => a.id);
}

export async function updateAccount(t: Transaction, id: number, change: { role?: Role; active?: boolean }) {
  const { User } = models();
  await User.update(change, { where: { id }, transaction: t });
}

/** A new password also clears the account's own failure count and lock. */
export async function setPassword(
  t: Transaction,
  id: number,
  passwordHash: string,
  opts: { mustChange: boolean },
): Promise<void> {
  const { User } = models();
  await User.update(
    { passwordHash, failedAttempts: 0, lockedUntil: null, mustChangePassword: opts.mustChange },
    { where: { id }, transaction: t },
  );
}

export async function findShop(id: number): Promise<ShopRecord | null> {
  const { Shop } = models();
  const s = await Shop.findByPk(id);
  return s ? { id: s.id, name: s.name, unitSystem: s.unitSystem, guardBandPolicy: s.guardBandPolicy } : null;
}

export async function findShopContact(id: number): Promise<ShopContact | null> {
  const { Shop } = models();
  const shop = await Shop.findByPk(id);
  return shop ? { name: shop.name, email: shop.email ?? null, phone: shop.phone ?? null } : null;
}
