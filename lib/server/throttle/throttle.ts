import "server-only";
import { createHash } from "node:crypto";
import { AppError } from "@/lib/server/core/errors";
import {
  clearKeys,
  clearKeysStartingWith,
  countEvents,
  forgetOldCounts,
  readCounts,
  type Counted,
  type ThrottleCount,
  type ThrottleRule,
} from "@/lib/server/throttle/repo";

// The shared throttle: named counters kept in the database (auth_throttle), so every app instance
// counts together. A caller names its keys ("signin:pair:ann@x.test|192.0.2.7") and a rule for
// each; sign-in, e-signing and forgotten-password requests each keep their numbers beside them.

export type { ThrottleCount, ThrottleRule };
export type Limit = Counted;

// auth_throttle.throttle_key holds 191 characters; a longer key is kept by its SHA-256 (callers that
// clear by prefix keep their keys short, as sign-in does with long e-mails).
const KEY_MAX = 191;
const fitted = (key: string) =>
  key.length <= KEY_MAX ? key : `${key.slice(0, 40)}#${createHash("sha256").update(key).digest("hex")}`;

export const limit = (key: string, rule: ThrottleRule): Limit => ({ key: fitted(key), rule });

/** Each limit's events in its window and its lock while ahead, in the order given. */
export const readLimits = (limits: Limit[]) => readCounts(limits);

/** Counts one event on each limit; now and then also forgets rows that ended a day ago. */
export async function countOne(limits: Limit[]): Promise<ThrottleCount[]> {
  const counts = await countEvents(limits);
  if (Math.random() < 0.02) await forgetOldCounts();
  return counts;
}

export { clearKeys as clearLimits, clearKeysStartingWith as clearLimitsStartingWith };

/** The latest lock among these counts that is still ahead, or null. */
export function lockedUntil(counts: ThrottleCount[]): Date | null {
  const ahead = counts.map((c) => c.lockedUntil?.getTime() ?? 0).filter((t) => t > Date.now());
  return ahead.length ? new Date(Math.max(...ahead)) : null;
}

/**
 * A 429 for a lock ending at `until`, with Retry-After in whole seconds. `words` gets the minutes
 * to wait (at least 1) and says what to do meanwhile.
 */
export function tooManyAttempts(until: Date, words: (minutes: number) => string): AppError {
  const seconds = Math.max(1, Math.ceil((until.getTime() - Date.now()) / 1000));
  return new AppError("too_many_attempts", words(Math.ceil(seconds / 60)), undefined, {
    "Retry-After": String(seconds),
  });
}

/** Throws the 429 while any of these limits is locked. */
export async function refuseWhileLocked(limits: Limit[], words: (minutes: number) => string): Promise<void> {
  const until = lockedUntil(await readLimits(limits));
  if (until) throw tooManyAttempts(until, words);
}

/**
 * For requests that are limited however they turn out (asking for a password-reset mail): refuses
 * while locked, otherwise counts this one.
 */
export async function spendAttempt(limits: Limit[], words: (minutes: number) => string): Promise<void> {
  await refuseWhileLocked(limits, words);
  await countOne(limits);
}
