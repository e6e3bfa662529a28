import "server-only";
import { Op } from "sequelize";
import { User } from "@/models";
import { getSequelize } from "@/lib/server/core/db";
import type { Role } from "@/lib/schemas/enums";

export type UserRecord = { id: number; shopId: number; name: string; email: string; role: Role; active: boolean };

function reshape(u: User): UserRecord {
  return { id: u.id, shopId: u.shopId, name: u.name, email: u.email, role: u.role as Role, active: u.active };
}

export async function findActiveUser(id: number, shopId: number): Promise<UserRecord | null> {
  getSequelize();
  const u = await User.findOne({ where: { id, shopId, active: true } });
  return u ? reshape(u) : null;
}

/** Active accounts with this e-mail in any shop (e-mail is unique per shop, not globally). */
export async function findSignInCandidates(email: string) {
  getSequelize();
  const users = await User.findAll({ where: { email: email.toLowerCase(), active: true }, limit: 10 });
  return users.map((u) => ({ ...reshape(u), passwordHash: u.passwordHash }));
}

export async function markSignedIn(id: number) {
  getSequelize();
  await User.update({ lastSignInAt: new Date() }, { where: { id } });
}

export async function listUsers(shopId: number, opts: { activeOnly?: boolean } = {}) {
  getSequelize();
  const users = await User.findAll({
    where: { shopId, ...(opts.activeOnly ? { active: true } : {}) },
    order: [["name", "ASC"]],
  });
  return users.map(reshape);
}

export async function countActiveAdmins(shopId: number, exceptId?: number) {
  getSequelize();
  return User.count({
    where: { shopId, role: "admin", active: true, ...(exceptId ? { id: { [Op.ne]: exceptId } } : {}) },
  });
}
