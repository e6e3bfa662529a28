import "server-only";
import { createHash } from "node:crypto";
import { addressBucket } from "@/lib/server/core/ip";
import { limit, readLimits, type ThrottleCount } from "@/lib/server/throttle/throttle";

// The sign-in throttle's numbers, all here. "E-mail" is the address typed, known or made up, so
// the answers never tell an account that exists from one that does not. The rules in words are
// in DEVELOPERS.md ("Sign-in throttle").
export const SIGN_IN_RULES = {
  /** Wrong passwords for one e-mail from one client address: that address is shut out of it. */
  pair: { windowMinutes: 15, limit: 5, lockMinutes: 15 },
  /**
   * Wrong passwords for one e-mail from anywhere: the e-mail is then under attack, and every
   * address that has failed on it is shut out of it while it lasts (one guess per address).
   */
  account: { windowMinutes: 60, limit: 20, lockMinutes: 60 },
  /**
   * Wrong passwords from one address for any e-mails (a spray of made-up ones): its wrong passwords
   * are then answered 429; a right password for a real account from it still gets in.
   */
  address: { windowMinutes: 15, limit: 30, lockMinutes: 15 },
} as const;

export type SignInCounts = { pair: ThrottleCount; account: ThrottleCount; address: ThrottleCount };

/** The e-mail as keys hold it: lower-case; a long one by its SHA-256, so every key fits its column. */
function norm(email: string): string {
  const lower = email.trim().toLowerCase();
  return lower.length <= 100 ? lower : `sha256:${createHash("sha256").update(lower).digest("hex")}`;
}

/** The three counters one sign-in attempt touches. */
export function signInLimits(email: string, address: string) {
  const bucket = addressBucket(address);
  return [
    limit(`signin:pair:${norm(email)}|${bucket}`, SIGN_IN_RULES.pair),
    limit(`signin:account:${norm(email)}`, SIGN_IN_RULES.account),
    limit(`signin:address:${bucket}`, SIGN_IN_RULES.address),
  ];
}

export const named = ([pair, account, address]: ThrottleCount[]): SignInCounts => ({ pair, account, address });

export async function readSignInCounts(email: string, address: string): Promise<SignInCounts> {
  return named(await readLimits(signInLimits(email, address)));
}

/** The lock that keeps this address out of this e-mail before any password is checked, if any. */
export function shutOutUntil(c: SignInCounts): Date | null {
  if (c.pair.lockedUntil) return c.pair.lockedUntil;
  if (c.account.lockedUntil && c.pair.failures > 0) return c.account.lockedUntil;
  return null;
}

/** Key prefix of every per-address counter of one e-mail, and its own account counter. */
export const accountKeys = (email: string) => ({
  pairPrefix: `signin:pair:${norm(email)}|`,
  account: `signin:account:${norm(email)}`,
});
