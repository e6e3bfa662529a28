import "server-only";
import bcrypt from "bcryptjs";
import { AuthThrottle } from "@/models";
import { getSequelize } from "@/lib/server/core/db";
import { AppError } from "@/lib/server/core/errors";
import { findSignInCandidates, markSignedIn, type UserRecord } from "@/lib/server/users/repo";

// Wrong password and unknown user get the same words. Failures are counted per e-mail and per
// address: after SLOW_AFTER the reply is delayed, after LOCK_AFTER the key is locked for LOCK_MINUTES.
export const SIGN_IN_REFUSED = "That e-mail and password do not match an active account";
const WINDOW_MINUTES = 15;
const SLOW_AFTER = 3;
const LOCK_AFTER = 8;
const LOCK_MINUTES = 15;
// A real hash of a random string, compared when no user matches so timing does not reveal it.
const DUMMY_HASH = "$2b$10$bvKUzmgPTBI2tlqKXg4njuJXa2RrBAtLFCawRkjpRVxnDL7r4TmvW";

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function lockedUntil(keys: string[]): Promise<Date | null> {
  const rows = await AuthThrottle.findAll({ where: { throttleKey: keys } });
  const now = Date.now();
  const locks = rows.map((r) => r.lockedUntil?.getTime() ?? 0).filter((t) => t > now);
  return locks.length ? new Date(Math.max(...locks)) : null;
}

async function recordFailure(keys: string[]): Promise<number> {
  let worst = 0;
  const now = new Date();
  for (const key of keys) {
    const [row] = await AuthThrottle.findOrCreate({
      where: { throttleKey: key },
      defaults: { throttleKey: key, failures: 0, windowStartedAt: now, lockedUntil: null },
    });
    const fresh = now.getTime() - row.windowStartedAt.getTime() > WINDOW_MINUTES * 60_000;
    const failures = fresh ? 1 : row.failures + 1;
    const lock = failures >= LOCK_AFTER ? new Date(now.getTime() + LOCK_MINUTES * 60_000) : row.lockedUntil;
    await row.update({ failures, windowStartedAt: fresh ? now : row.windowStartedAt, lockedUntil: lock });
    worst = Math.max(worst, failures);
  }
  return worst;
}

export async function signIn(email: string, password: string, address: string): Promise<UserRecord> {
  getSequelize();
  const keys = [`email:${email.toLowerCase()}`, `ip:${address}`];
  const until = await lockedUntil(keys);
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
    const failures = await recordFailure(keys);
    if (failures > SLOW_AFTER) await sleep(Math.min(4000, (failures - SLOW_AFTER) * 500));
    throw new AppError("unauthorized", SIGN_IN_REFUSED);
  }
  await AuthThrottle.destroy({ where: { throttleKey: keys[0] } });
  await markSignedIn(match.id);
  return match;
}
