import "server-only";
import bcrypt from "bcryptjs";
import { randomBytes } from "node:crypto";

/**
 * The bcrypt cost for every password the app stores: 2^12 rounds, about a quarter of a second on
 * one core of a current server, slow enough to make guessing from a stolen table expensive and
 * quick enough for a sign-in. Raising it later is safe: each stored hash carries its own cost.
 */
export const BCRYPT_COST = 12;

export const hashPassword = (password: string) => bcrypt.hash(password, BCRYPT_COST);

export const passwordMatches = (password: string, hash: string) => bcrypt.compare(password, hash);

/** A hash of 256 random bits nobody knows: an invited account cannot be signed into before its link is used. */
export const unusableHash = () => hashPassword(randomBytes(32).toString("base64url"));

let dummy: Promise<string> | undefined;

/** A real hash at the same cost, compared when no account matches, so the time taken reveals nothing. */
export function dummyHash(): Promise<string> {
  dummy ??= unusableHash();
  return dummy;
}
