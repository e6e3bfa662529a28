import "server-only";
import { sealData, unsealData } from "iron-session";
import { cookies } from "next/headers";
import { env, servedOverHttps } from "@/lib/server/core/env";
import type { Role } from "@/lib/schemas/enums";

// Session type, defaults and options in one module. The cookie is sealed with
// iron-session; we seal/unseal ourselves so route handlers read it straight from the Request,
// which lets tests call exported handlers without a Next request context.

/** `sessionId` names the user_sessions row; a cookie sealed before sessions had rows has none and is refused. */
export type SessionData = {
  sessionId: string;
  userId: number;
  shopId: number;
  role: Role;
  name: string;
  issuedAt: number;
};

export const SESSION_COOKIE = "tw_session";

export function ttlSeconds() {
  return Math.round(env().SESSION_TTL_HOURS * 3600);
}

export async function sealSession(data: SessionData): Promise<string> {
  return sealData(data, { password: env().SESSION_SECRET, ttl: ttlSeconds() });
}

export async function unsealSession(sealed: string | undefined): Promise<SessionData | null> {
  if (!sealed) return null;
  try {
    const data = await unsealData<Partial<SessionData>>(sealed, { password: env().SESSION_SECRET, ttl: ttlSeconds() });
    const complete =
      typeof data.sessionId === "string" && typeof data.userId === "number" && typeof data.shopId === "number";
    return complete ? (data as SessionData) : null;
  } catch {
    return null;
  }
}

export function sessionCookieHeader(value: string, maxAge = ttlSeconds()): string {
  const parts = [`${SESSION_COOKIE}=${value}`, "Path=/", "HttpOnly", "SameSite=Lax", `Max-Age=${maxAge}`];
  if (servedOverHttps()) parts.push("Secure");
  return parts.join("; ");
}

export const clearSessionCookieHeader = () => sessionCookieHeader("", 0);

export function readCookie(req: Request, name: string): string | undefined {
  const header = req.headers.get("cookie");
  if (!header) return undefined;
  for (const part of header.split(";")) {
    const [k, ...v] = part.trim().split("=");
    if (k === name) return decodeURIComponent(v.join("="));
  }
  return undefined;
}

export async function sessionFromRequest(req: Request): Promise<SessionData | null> {
  return unsealSession(readCookie(req, SESSION_COOKIE));
}

/** For server components and layouts. */
export async function getPageSession(): Promise<SessionData | null> {
  const store = await cookies();
  return unsealSession(store.get(SESSION_COOKIE)?.value);
}
