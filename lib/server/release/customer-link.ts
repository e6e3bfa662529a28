import "server-only";
import { createHmac, timingSafeEqual } from "node:crypto";
import { env, linkSecret } from "@/lib/server/core/env";

// The customer's link to one signed build record: `r1.<releaseId>.<expires>.<signature>`, an
// HMAC-SHA256 (keyed by LINK_SECRET) over the release id and expiry. It opens /r/<token> and
// /api/r/<token>/pdf and nothing else: it is not a session, and no other route reads it.
const VERSION = "r1";

export type LinkCheck =
  | { ok: true; releaseId: number; expiresAt: Date }
  | { ok: false; reason: "expired"; releaseId: number; expiresAt: Date }
  | { ok: false; reason: "invalid" };

function sign(releaseId: number, expires: number): string {
  return createHmac("sha256", linkSecret())
    .update(`tenthwise-record:${VERSION}:${releaseId}:${expires}`)
    .digest("base64url");
}

/** A link token for one release, valid for ttlSeconds (default LINK_TTL_DAYS). */
export function createCustomerToken(releaseId: number, opts: { ttlSeconds?: number; now?: number } = {}): string {
  if (!Number.isInteger(releaseId) || releaseId <= 0)
    throw new Error(`A record link needs a release id; got ${String(releaseId)}`);
  const ttl = opts.ttlSeconds ?? Math.round(env().LINK_TTL_DAYS * 86_400);
  const expires = Math.floor((opts.now ?? Date.now()) / 1000) + ttl;
  return `${VERSION}.${releaseId}.${expires}.${sign(releaseId, expires)}`;
}

export function customerLinkUrl(token: string): string {
  return `${env().APP_URL.replace(/\/$/, "")}/r/${token}`;
}

/** Checks the signature first, so "expired" is only ever said of a link we really made. */
export function checkCustomerToken(token: string | undefined, now = Date.now()): LinkCheck {
  const parts = (token ?? "").split(".");
  if (parts.length !== 4 || parts[0] !== VERSION || !/^\d{1,10}$/.test(parts[1]) || !/^\d{1,12}$/.test(parts[2]))
    return { ok: false, reason: "invalid" };
  const releaseId = Number(parts[1]);
  const expires = Number(parts[2]);
  const given = Buffer.from(parts[3], "base64url");
  const wanted = Buffer.from(sign(releaseId, expires), "base64url");
  if (given.length !== wanted.length || !timingSafeEqual(given, wanted)) return { ok: false, reason: "invalid" };
  const expiresAt = new Date(expires * 1000);
  if (now >= expires * 1000) return { ok: false, reason: "expired", releaseId, expiresAt };
  return { ok: true, releaseId, expiresAt };
}
