import "server-only";
import bcrypt from "bcryptjs";
import type { Transaction } from "sequelize";
import { AppError } from "@/lib/server/core/errors";
import { dummyHash } from "@/lib/server/passwords/hash";
import { clearLimits, clearLimitsStartingWith, countOne, tooManyAttempts } from "@/lib/server/throttle/throttle";
import { findSignInCandidates, markSignedIn, type UserRecord } from "@/lib/server/users/repo";
import { accountKeys, named, readSignInCounts, shutOutUntil, signInLimits } from "@/lib/server/users/sign-in-limits";
import { assertShopOpen } from "@/lib/server/shops/signup";

// Wrong password and unknown user get the same words, the same work (a bcrypt compare) and the same
// counting, so no answer tells whether an e-mail has an account. The limits: sign-in-limits.ts.
export const SIGN_IN_REFUSED = "That e-mail and password do not match an active account";

const waitWords = (minutes: number) =>
  `Too many failed sign-ins from here. Try again in ${minutes} min, or ask your shop admin to reset your password.`;

async function matching(email: string, password: string): Promise<UserRecord | null> {
  const candidates = await findSignInCandidates(email);
  // A real hash at the stored cost, compared when no user matches so timing does not reveal it.
  if (!candidates.length) await bcrypt.compare(password, await dummyHash());
  for (const c of candidates) if (await bcrypt.compare(password, c.passwordHash)) return c;
  return null;
}

/** Signs in from `address` (clientAddress of the request), or refuses with 401 or 429. */
export async function signIn(email: string, password: string, address: string): Promise<UserRecord> {
  const limits = signInLimits(email, address);
  const before = shutOutUntil(await readSignInCounts(email, address));
  if (before) throw tooManyAttempts(before, waitWords);
  const match = await matching(email, password);
  if (!match) {
    const after = named(await countOne(limits));
    if (after.address.lockedUntil) throw tooManyAttempts(after.address.lockedUntil, waitWords);
    throw new AppError("unauthorized", SIGN_IN_REFUSED);
  }
  await assertShopOpen(match);
  // This address's own mistakes on this e-mail are forgiven; the e-mail's count from everywhere and
  // the address's count over all e-mails stay, so signing in to one's own account resets no attack.
  await clearLimits([limits[0].key]);
  await markSignedIn(match.id);
  return match;
}

/** A new password lifts every sign-in lock on the e-mail, so its owner gets in from anywhere. */
export async function liftSignInLocks(email: string, t?: Transaction): Promise<void> {
  const keys = accountKeys(email);
  await clearLimits([keys.account], t);
  await clearLimitsStartingWith(keys.pairPrefix, t);
}
