import "server-only";
import bcrypt from "bcryptjs";
import type { SignInput } from "@/lib/schemas/release";
import type { Actor } from "@/lib/schemas/session";
import { AppError } from "@/lib/server/core/errors";
import { clearLimits, countOne, limit, refuseWhileLocked } from "@/lib/server/throttle/throttle";
import { findSigner } from "@/lib/server/users/repo";

// The e-signature's check: the signer types their full name and their password again. Wrong
// passwords are counted per signer (kept in auth_throttle like sign-in's, so every app instance
// sees the same count); five in a quarter of an hour lock signing for a quarter of an hour.
const RULE = { windowMinutes: 15, limit: 5, lockMinutes: 15 };

/** Names compared ignoring case and runs of spaces: "hanne  VOSS" signs for "Hanne Voss". */
const normalName = (s: string) => s.trim().replace(/\s+/g, " ").toLocaleLowerCase("en");

const waitWords = (minutes: number) =>
  `Too many wrong passwords. Try again in ${minutes} min, or sign out and in again.`;

/** The name as signed (spaces tidied), once the typed name and the password are the account's. */
export async function checkSigner(actor: Actor, input: SignInput): Promise<string> {
  const signing = limit(`release-sign:${actor.userId}`, RULE);
  await refuseWhileLocked([signing], waitWords);
  const account = await findSigner(actor.userId, actor.shopId);
  if (!account) throw new AppError("unauthorized", "Sign in first");
  if (normalName(input.fullName) !== normalName(account.name)) {
    throw new AppError("invalid", "The typed name does not match your account", {
      fullName: [`Type your full name as it is on your account, "${account.name}" (capital letters do not matter)`],
    });
  }
  if (!(await bcrypt.compare(input.password, account.passwordHash))) {
    await countOne([signing]);
    throw new AppError("forbidden", "That password is not right, so nothing was signed", {
      password: ["Enter the password you sign in with"],
    });
  }
  await clearLimits([signing.key]);
  return input.fullName.trim().replace(/\s+/g, " ");
}
