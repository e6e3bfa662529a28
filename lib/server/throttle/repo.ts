import "server-only";
import { Op, type Transaction } from "sequelize";
import { models } from "@/lib/server/core/db";

// auth_throttle rows: one counter per key, in the database so every app instance counts together.
// Each step is one atomic statement, so two instances counting the same key at once both count.

/** How many events within how long lock a key, and for how long. */
export type ThrottleRule = { windowMinutes: number; limit: number; lockMinutes: number };

/** A key's events in its current window (0 once the window has passed) and its lock, if ahead. */
export type ThrottleCount = { failures: number; lockedUntil: Date | null };

export type Counted = { key: string; rule: ThrottleRule };

const minutesBefore = (now: Date, minutes: number) => new Date(now.getTime() - minutes * 60_000);

function current(
  row: { failures: number; windowStartedAt: Date; lockedUntil: Date | null } | undefined,
  rule: ThrottleRule,
  now: Date,
): ThrottleCount {
  if (!row) return { failures: 0, lockedUntil: null };
  const inWindow = row.windowStartedAt > minutesBefore(now, rule.windowMinutes);
  const locked = row.lockedUntil && row.lockedUntil > now ? row.lockedUntil : null;
  return { failures: inWindow ? row.failures : 0, lockedUntil: locked };
}

/** The count and lock of each key, in the order asked. */
export async function readCounts(entries: Counted[], now = new Date()): Promise<ThrottleCount[]> {
  const { AuthThrottle } = models();
  const rows = await AuthThrottle.findAll({ where: { throttleKey: entries.map((e) => e.key) } });
  const byKey = new Map(rows.map((r) => [r.throttleKey, r]));
  return entries.map((e) => current(byKey.get(e.key), e.rule, now));
}

/**
 * Counts one event on each key (outside any transaction, so a rollback cannot undo it): a window
 * that has passed starts over; reaching the rule's limit locks the key for its lockMinutes (a
 * lock already running is not lengthened).
 */
export async function countEvents(entries: Counted[], now = new Date()): Promise<ThrottleCount[]> {
  const { AuthThrottle } = models();
  await AuthThrottle.bulkCreate(
    entries.map((e) => ({ throttleKey: e.key, failures: 0, windowStartedAt: now, lockedUntil: null })),
    { ignoreDuplicates: true },
  );
  for (const { key, rule } of entries) {
    const stale = minutesBefore(now, rule.windowMinutes);
    await AuthThrottle.update(
      { failures: 0, windowStartedAt: now },
      { where: { throttleKey: key, windowStartedAt: { [Op.lte]: stale } } },
    );
    await AuthThrottle.increment("failures", { where: { throttleKey: key } });
    await AuthThrottle.update(
      { lockedUntil: new Date(now.getTime() + rule.lockMinutes * 60_000) },
      {
        where: {
          throttleKey: key,
          failures: { [Op.gte]: rule.limit },
          [Op.or]: [{ lockedUntil: null }, { lockedUntil: { [Op.lte]: now } }],
        },
      },
    );
  }
  return readCounts(entries, now);
}

export async function clearKeys(keys: string[], t?: Transaction): Promise<void> {
  const { AuthThrottle } = models();
  await AuthThrottle.destroy({ where: { throttleKey: keys }, transaction: t });
}

/** Every key that begins with `prefix` (all the per-address counters of one e-mail). */
export async function clearKeysStartingWith(prefix: string, t?: Transaction): Promise<void> {
  const { AuthThrottle } = models();
  const pattern = `${prefix.replace(/[\\%_]/g, "\\$&")}%`;
  await AuthThrottle.destroy({ where: { throttleKey: { [Op.like]: pattern } }, transaction: t });
}

/** Rows whose window and lock both ended a day ago: made-up e-mails and passing addresses. */
export async function forgetOldCounts(now = new Date()): Promise<void> {
  const { AuthThrottle } = models();
  const dayAgo = minutesBefore(now, 24 * 60);
  await AuthThrottle.destroy({
    where: {
      windowStartedAt: { [Op.lt]: dayAgo },
      [Op.or]: [{ lockedUntil: null }, { lockedUntil: { [Op.lt]: dayAgo } }],
    },
  });
}
