import "server-only";
import { createHash, randomBytes } from "node:crypto";
import type { Transaction } from "sequelize";
import type { LinkPurpose } from "@/lib/schemas/enums";
import { getSequelize } from "@/lib/server/core/db";
import { env } from "@/lib/server/core/env";
import { AppError } from "@/lib/server/core/errors";
import { claimTokenRow, findTokenRow, insertTokenRow, voidUnusedTokenRows, type TokenRow } from "./repo";

// One-time links sent by e-mail: an invitation to set a password, a password reset, a check that an
// e-mail address is the person's. The token is 256 random bits (base64url) and travels only in the
// message; the table keeps its SHA-256, so a copy of the database opens no account. A link works
// once, until it expires, and only while it is the person's latest link of its purpose.

const TOKEN_BYTES = 32;

/** How long each kind of link lasts, in minutes, when the caller has no reason to choose. */
export const LINK_TTL_MINUTES: Record<LinkPurpose, number> = {
  verify_email: 24 * 60,
  set_password: 72 * 60, // an invitation may wait over a weekend
  reset_password: 60, // a reset is asked for by someone at a screen right now
};

export type IssueTokenInput = { purpose: LinkPurpose; userId: number; shopId: number; ttlMinutes?: number };
export type IssuedToken = { token: string; expiresAt: Date };
export type TokenOwner = { userId: number; shopId: number };
export type TokenProblem = "unknown" | "used" | "replaced" | "expired";

export const hashToken = (token: string) => createHash("sha256").update(token, "utf8").digest("hex");

function within<T>(t: Transaction | undefined, work: (t: Transaction) => Promise<T>): Promise<T> {
  return t ? work(t) : getSequelize().transaction(work);
}

const ASK_AGAIN: Record<LinkPurpose, string> = {
  verify_email: "Sign in to have a new confirmation message sent.",
  set_password: "Ask your shop's admin to send the invitation again.",
  reset_password: 'Ask for a new one from "Forgot password" on the sign-in screen.',
};

/** The words for a link that cannot be used, saying what to do instead. */
export function tokenProblemWords(purpose: LinkPurpose, problem: TokenProblem): string {
  const what = {
    unknown: "This link is not one we sent, or only part of it was copied.",
    used: "This link has already been used; each link works once.",
    replaced: "A newer link was sent after this one, so this one no longer works. Use the latest message.",
    expired: "This link has expired.",
  }[problem];
  return problem === "replaced" ? what : `${what} ${ASK_AGAIN[purpose]}`;
}

function problemOf(row: TokenRow | null, purpose: LinkPurpose, now: Date): TokenProblem | null {
  if (!row || row.purpose !== purpose) return "unknown";
  if (row.usedAt) return "used";
  if (row.voidedAt) return "replaced";
  if (row.expiresAt.getTime() <= now.getTime()) return "expired";
  return null;
}

function refuse(purpose: LinkPurpose, problem: TokenProblem): AppError {
  const words = tokenProblemWords(purpose, problem);
  return new AppError("gone", words, { token: [words] });
}

/** A new link token for this person; their earlier unused links of the same purpose stop working. */
export async function issueToken(input: IssueTokenInput, t?: Transaction): Promise<IssuedToken> {
  const ttl = input.ttlMinutes ?? LINK_TTL_MINUTES[input.purpose];
  if (!(ttl > 0)) throw new Error(`A link needs a positive lifetime in minutes; got ${String(ttl)}`);
  const token = randomBytes(TOKEN_BYTES).toString("base64url");
  const now = new Date();
  const expiresAt = new Date(now.getTime() + Math.round(ttl * 60_000));
  await within(t, async (tx) => {
    await voidUnusedTokenRows(tx, input.userId, input.purpose, now);
    const row = { tokenHash: hashToken(token), purpose: input.purpose, userId: input.userId, shopId: input.shopId };
    await insertTokenRow(tx, { ...row, expiresAt });
  });
  return { token, expiresAt };
}

/**
 * Uses the link up and answers whose it is; throws AppError "gone" (410) saying why not. Inside the
 * caller's transaction the use rolls back with the caller's work (a refused password keeps the link).
 */
export async function consumeToken(purpose: LinkPurpose, token: string, t?: Transaction): Promise<TokenOwner> {
  const tokenHash = hashToken(token);
  return within(t, async (tx) => {
    const now = new Date();
    if (await claimTokenRow(tx, tokenHash, purpose, now)) {
      const row = (await findTokenRow(tokenHash, tx))!;
      return { userId: row.userId, shopId: row.shopId };
    }
    throw refuse(purpose, problemOf(await findTokenRow(tokenHash, tx), purpose, now) ?? "used");
  });
}

/** Whose the link is and until when, without using it (a page showing its form); throws like consumeToken. */
export async function checkToken(purpose: LinkPurpose, token: string): Promise<TokenOwner & { expiresAt: Date }> {
  const row = await findTokenRow(hashToken(token));
  const problem = problemOf(row, purpose, new Date());
  if (problem || !row) throw refuse(purpose, problem ?? "unknown");
  return { userId: row.userId, shopId: row.shopId, expiresAt: row.expiresAt };
}

/** The address of a page that takes a link token, e.g. tokenLink("/set-password", token). */
export function tokenLink(pathname: string, token: string): string {
  const base = env().APP_URL.replace(/\/+$/, "");
  const path = pathname.replace(/^\/+|\/+$/g, "");
  return `${base}/${path}/${encodeURIComponent(token)}`;
}
