import "server-only";
import { Op, type Transaction } from "sequelize";
import { getSequelize, models } from "@/lib/server/core/db";
import { causalRows, withConflictRetry } from "@/lib/server/core/cluster";
import { utcDate } from "@/lib/server/core/sql-driver";

// auth_throttle rows: one counter per key, in the database so every app instance counts together.
// Each count is one atomic statement, retried on a conflict, so two instances counting the same key
// at once both count, on one database or on a cluster.

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

type ThrottleRow = { key: string; failures: number; windowStartedAt: unknown; lockedUntil: unknown };

/**
 * The count and lock of each key, in the order asked. A causal read (core/cluster.ts): failures
 * counted through another app instance on another database node a moment ago are seen.
 */
export async function readCounts(entries: Counted[], now = new Date()): Promise<ThrottleCount[]> {
  if (entries.length === 0) return [];
  const rows = await causalRows<ThrottleRow>(
    null,
    `SELECT throttle_key AS \`key\`, failures, window_started_at AS windowStartedAt, locked_until AS lockedUntil
       FROM auth_throttle WHERE throttle_key IN (?)`,
    [entries.map((e) => e.key)],
  );
  const byKey = new Map(
    rows.map((r) => [
      r.key,
      {
        failures: Number(r.failures),
        windowStartedAt: utcDate(r.windowStartedAt)!,
        lockedUntil: utcDate(r.lockedUntil),
      },
    ]),
  );
  return entries.map((e) => current(byKey.get(e.key), e.rule, now));
}

// One statement per key: a new key starts at 1; a passed window starts over at 1; reaching the limit
// locks the key unless a lock is already running. MariaDB applies the assignments left to right,
// each seeing the ones before, so the lock sees the new count and the window moves last.
const COUNT_SQL = `INSERT INTO auth_throttle (throttle_key, failures, window_started_at, locked_until)
  VALUES (:key, 1, :now, IF(1 >= :limit, :lockEnd, NULL))
  ON DUPLICATE KEY UPDATE
    failures = IF(window_started_at <= :stale, 1, failures + 1),
    locked_until = IF(failures >= :limit AND (locked_until IS NULL OR locked_until <= :now), :lockEnd, locked_until),
    window_started_at = IF(window_started_at <= :stale, :now, window_started_at)`;

/**
 * Counts one event on each key, outside any transaction (a rollback cannot undo it): a window
 * that has passed starts over; reaching the rule's limit locks the key for its lockMinutes (a
 * lock already running is not lengthened). Each key's count is one atomic statement, so two
 * instances counting at once both count: on one database the second waits for the first's row; on
 * a cluster the later commit fails certification (1213) and the statement runs again on top of it.
 */
export async function countEvents(entries: Counted[], now = new Date()): Promise<ThrottleCount[]> {
  for (const { key, rule } of entries) {
    const replacements = {
      key,
      now,
      limit: rule.limit,
      stale: minutesBefore(now, rule.windowMinutes),
      lockEnd: new Date(now.getTime() + rule.lockMinutes * 60_000),
    };
    await withConflictRetry(() => getSequelize().query(COUNT_SQL, { replacements }));
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
