import "server-only";
import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { cache } from "react";
import { PAGE_PATH_HEADER } from "@/lib/nav";
import { AppError } from "@/lib/server/core/errors";
import { classifyDbError } from "@/lib/server/core/db-errors";
import { DB_UNAVAILABLE_DIGEST } from "@/lib/schemas/errors";
import type { Role } from "@/lib/schemas/enums";
import type { Actor } from "@/lib/schemas/session";
import { getPageSession, sessionFromRequest, type SessionData } from "@/lib/server/core/session";
import { isSessionLive } from "@/lib/server/sessions/repo";
import { findActiveUser } from "@/lib/server/users/repo";

// Who is asking (Actor, lib/schemas/session.ts), checked against the database on every request so a
// deactivated user or an ended session (signed out, password reset, role changed) takes effect at
// once. Every repo call takes `actor.shopId`.

export const ROLE_HOME: Record<Role, string> = {
  machinist: "/bench",
  lead: "/desk",
  inspector: "/release",
  admin: "/admin",
};

/** Where the account screen is: a temporary password is changed there before anything else. */
export const ACCOUNT_PAGE = "/account";

export const PASSWORD_CHANGE_FIRST =
  "Choose your own password first: the one you signed in with was set by an admin for one use. " +
  `Open Account (${ACCOUNT_PAGE}) to change it.`;

/** Where a person lands after signing in: their role's home, or the account screen while a change is owed. */
export const homeFor = (user: { role: Role; mustChangePassword?: boolean }) =>
  user.mustChangePassword ? ACCOUNT_PAGE : ROLE_HOME[user.role];

async function actorFrom(session: SessionData | null): Promise<Actor | null> {
  if (!session) return null;
  const [user, live] = await Promise.all([
    findActiveUser(session.userId, session.shopId),
    isSessionLive(session.sessionId, session.userId),
  ]);
  if (!user || !live) return null;
  const { id: userId, shopId, role, name, email, mustChangePassword } = user;
  return { userId, shopId, role, name, email, sessionId: session.sessionId, mustChangePassword };
}

export async function actorFromRequest(req: Request): Promise<Actor | null> {
  return actorFrom(await sessionFromRequest(req));
}

export function assertRole(actor: Actor, roles: readonly Role[] | "any"): void {
  if (roles !== "any" && !roles.includes(actor.role)) {
    throw new AppError("forbidden", `This needs one of these roles: ${roles.join(", ")}`);
  }
}

/**
 * The signed-in actor with one of `roles`. Someone who owes a password change is refused (403, with
 * words) unless the route is one they need for it (`whilePasswordMustChange`).
 */
export async function requireActor(
  req: Request,
  roles: readonly Role[] | "any" = "any",
  opts: { whilePasswordMustChange?: boolean } = {},
): Promise<Actor> {
  const actor = await actorFromRequest(req);
  if (!actor) throw new AppError("unauthorized", "Sign in first");
  if (actor.mustChangePassword && !opts.whilePasswordMustChange) throw new AppError("forbidden", PASSWORD_CHANGE_FIRST);
  assertRole(actor, roles);
  return actor;
}

/** Who is signed in for this page request, looked up once however many layouts and pages ask. */
export const currentPageActor = cache(async (): Promise<Actor | null> => {
  try {
    return await actorFrom(await getPageSession());
  } catch (err) {
    throw asPageError(err);
  }
});

/** A database outage as the error the page's error screen recognises (app/error.tsx). */
export function asPageError(err: unknown): unknown {
  if (classifyDbError(err)?.kind !== "outage") return err;
  console.error(JSON.stringify({ at: new Date().toISOString(), app: "tenthwise", event: "db_unavailable_page" }));
  return Object.assign(new Error("The server cannot reach its database"), { digest: DB_UNAVAILABLE_DIGEST });
}

/**
 * For pages and layouts: signed out → the sign-in page, which leads back to the page asked for
 * (proxy.ts hands on its path, because a layout cannot see the URL); wrong role → that user's own home.
 */
export async function requirePageActor(roles: readonly Role[] | "any" = "any"): Promise<Actor> {
  const actor = await currentPageActor();
  const from = (await headers()).get(PAGE_PATH_HEADER);
  if (!actor) redirect(from ? `/sign-in?next=${encodeURIComponent(from)}` : "/sign-in");
  const onAccountPage = from === ACCOUNT_PAGE || from?.startsWith(`${ACCOUNT_PAGE}?`);
  if (actor.mustChangePassword && !onAccountPage) redirect(ACCOUNT_PAGE);
  if (roles !== "any" && !roles.includes(actor.role)) redirect(ROLE_HOME[actor.role]);
  return actor;
}
