import "server-only";
import bcrypt from "bcryptjs";
import { AppError } from "@/lib/server/core/errors";
import {
  clearThrottle,
  countFailure,
  findSignInCandidates,
  markSignedIn,
  throttledUntil,
  type UserRecord,
} from "@/lib/server/users/repo";

// Wrong password and unknown user get the same words. Failures are counted per e-mail and per
// address: after SLOW_AFTER the reply is delayed; after POLICY.lockAfter within the window the
// key is locked for POLICY.lockMinutes.
export const SIGN_IN_REFUSED = "That e-mail and password do not match an active account";
const SLOW_AFTER = 3;
const POLICY = { windowMinutes: 15, lockAfter: 8, lockMinutes: 15 };
// A real hash of a random string, compared when no user matches so timing does not reveal it.
const DUMMY_HASH = "$2b$10$bvKUzmgPTBI2tlqKXg4njuJXa2RrBAtLFCawRkjpRVxnDL7r4TmvW";

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export async function signIn(email: string, password: string, address: string): Promise<UserRecord> {
  const keys = [`email:${email.toLowerCase()}`, `ip:${address}`];
  const until = await throttledUntil(keys);
  if (until) {
    const minutes = Math.max(1, Math.ceil((until.getTime() - Date.now()) / 60_000));
    throw new AppError(
      "too_many_attempts",
      `Too many failed sign-ins. Try again in ${minutes} min or ask your shop admin.`,
      undefined,
      {
        "Retry-After": String(minutes * 60),
      },
    );
  }
  const candidates = await findSignInCandidates(email);
  let match: UserRecord | null = null;
  for (const c of candidates) {
    if (await bcrypt.compare(password, c.passwordHash)) {
      match = c;
      break;
    }
  }
  if (!candidates.length) await bcrypt.compare(password, DUMMY_HASH);
  if (!match) {
    const failures = await countFailure(keys, POLICY);
    if (failures > SLOW_AFTER) await sleep(Math.min(4000, (failures - SLOW_AFTER) * 500));
    throw new AppError("unauthorized", SIGN_IN_REFUSED);
  }
  await clearThrottle([keys[0]]);
  await markSignedIn(match.id);
  return match;
}
