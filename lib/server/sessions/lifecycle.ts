import "server-only";
import { clearSessionCookieHeader, sealSession, ttlSeconds, type SessionData } from "@/lib/server/core/session";
import type { UserRecord } from "@/lib/server/users/repo";
import { createSessionRow, endSessionRow, pruneSessionRows } from "./repo";

// Opening and closing a sign-in. Closing ends the row on the server: the cookie may still sit in a
// browser (an offline tablet cannot delete an HttpOnly cookie), but it is refused from then on.

export type OpenedSession = { sessionId: string; cookie: string };

/** A new session row and its sealed cookie value; `replacing` is the session this device held before. */
export async function openSession(
  user: Pick<UserRecord, "id" | "shopId" | "role" | "name">,
  replacing?: SessionData | null,
): Promise<OpenedSession> {
  if (replacing) await endSessionRow(replacing.sessionId, "replaced");
  await pruneSessionRows(user.id, new Date(Date.now() - ttlSeconds() * 1000));
  const sessionId = await createSessionRow(user.id, user.shopId);
  const sealed = await sealSession({
    sessionId,
    userId: user.id,
    shopId: user.shopId,
    role: user.role,
    name: user.name,
    issuedAt: Date.now(),
  });
  return { sessionId, cookie: sealed };
}

/**
 * Signing out. With `sessionId` (a tablet that signed out offline, reporting it once back online) only
 * that session ends, and the cookie is cleared only if it is that session's: it may be the next
 * person's by then. Without it the cookie's own session ends. Answers the Set-Cookie header, if any.
 */
export async function closeSession(current: SessionData | null, sessionId?: string): Promise<string | undefined> {
  const target = sessionId ?? current?.sessionId;
  if (target) await endSessionRow(target, "signed_out");
  return !sessionId || current?.sessionId === sessionId ? clearSessionCookieHeader() : undefined;
}
