import "server-only";
import { Op, UniqueConstraintError, type Transaction } from "sequelize";
import type { Role, UnitSystem } from "@/lib/schemas/enums";
import type { TemplateValues } from "@/lib/schemas/spec";
import { models } from "@/lib/server/core/db";
import { limitRow } from "@/lib/server/specs/repo";

// Shops as tenants: the feature's one door to the database, plain objects out.

export type NewShop = { name: string; slug: string; unitSystem: UnitSystem; activatedAt: Date | null };
export type NewPerson = { name: string; email: string; passwordHash: string; role: Role };

/** A shop's name or slug is taken (the slug's unique index decides a race between two sign-ups). */
export class ShopTaken extends Error {}

export async function insertShop(t: Transaction, s: NewShop): Promise<number> {
  try {
    return (await models().Shop.create(s, { transaction: t })).id;
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw new ShopTaken(s.name);
    throw err;
  }
}

export async function insertPerson(t: Transaction, shopId: number, p: NewPerson): Promise<number> {
  const user = await models().User.create({ shopId, ...p, email: p.email.toLowerCase() }, { transaction: t });
  return user.id;
}

/** Writes the sheets (limits in order, each with its own common-practice mark); answers their ids. */
export async function insertSheets(t: Transaction, shopId: number, sheets: readonly TemplateValues[]) {
  const { SpecLimit, SpecTemplate } = models();
  const ids: number[] = [];
  for (const s of sheets) {
    const { limits, notes, ...header } = s;
    const row = await SpecTemplate.create({ shopId, ...header, notes: notes ?? null }, { transaction: t });
    await SpecLimit.bulkCreate(
      limits.map((l, i) => ({ ...limitRow(l, i, l.commonPractice === true), templateId: row.id })),
      { transaction: t },
    );
    ids.push(row.id);
  }
  return ids;
}

/** Whether a shop of this name (case and accents aside, by the column's collation) or slug exists. */
export async function shopNameTaken(name: string, slug: string): Promise<boolean> {
  const n = await models().Shop.count({ where: { [Op.or]: [{ name }, { slug }] } });
  return n > 0;
}

export async function emailHasAccount(email: string): Promise<boolean> {
  return (await accountOf(email)) !== null;
}

/** The account an address already has (in any shop), or null. */
export async function accountOf(email: string): Promise<{ userId: number; shopId: number } | null> {
  const u = await models().User.findOne({ where: { email: email.toLowerCase() }, attributes: ["id", "shopId"] });
  return u ? { userId: u.id, shopId: u.shopId } : null;
}

export type ShopState = { id: number; name: string; activatedAt: Date | null };

export async function findShop(shopId: number, t?: Transaction): Promise<ShopState | null> {
  const s = await models().Shop.findByPk(shopId, { transaction: t, attributes: ["id", "name", "activatedAt"] });
  return s ? { id: s.id, name: s.name, activatedAt: s.activatedAt ?? null } : null;
}

/** Marks the shop usable; answers false when it already was. */
export async function activateShop(t: Transaction, shopId: number, at: Date): Promise<boolean> {
  const [n] = await models().Shop.update(
    { activatedAt: at },
    { where: { id: shopId, activatedAt: null }, transaction: t },
  );
  return n === 1;
}

export type PendingAdmin = { userId: number; shopId: number; name: string; email: string; shopName: string };

/** The first admin of a shop still waiting for its e-mail to be confirmed, by that e-mail. */
export async function findPendingAdmin(email: string): Promise<PendingAdmin | null> {
  const { Shop, User } = models();
  const users = await User.findAll({ where: { email: email.toLowerCase(), role: "admin", active: true } });
  if (!users.length) return null;
  const shop = await Shop.findOne({ where: { id: users.map((u) => u.shopId), activatedAt: null } });
  const user = shop && users.find((u) => u.shopId === shop.id);
  if (!shop || !user) return null;
  return { userId: user.id, shopId: shop.id, name: user.name, email: user.email, shopName: shop.name };
}

export async function findPerson(userId: number, shopId: number) {
  const u = await models().User.findOne({ where: { id: userId, shopId } });
  return u ? { id: u.id, name: u.name, email: u.email, role: u.role, active: u.active } : null;
}

/** The outbox row queued under a dedupe key (to send it at once after the transaction). */
export async function outboxIdByKey(dedupeKey: string): Promise<number | null> {
  const row = await models().MailOutbox.findOne({ where: { dedupeKey }, attributes: ["id"] });
  return row?.id ?? null;
}

/** What the first-job guide ticks, counted in the shop only. */
export async function guideCounts(shopId: number) {
  const { AuditEvent, Instrument, Job, Reading } = models();
  const [gauges, sheetEdits, jobs, firstJob, readings] = await Promise.all([
    Instrument.count({ where: { shopId } }),
    AuditEvent.count({ where: { shopId, action: { [Op.like]: "spec_template.%" } } }),
    Job.count({ where: { shopId } }),
    Job.findOne({ where: { shopId }, order: [["id", "ASC"]], attributes: ["id"] }),
    Reading.count({ where: { shopId } }),
  ]);
  return { gauges, sheetEdits, jobs, firstJobId: firstJob?.id ?? null, readings };
}
