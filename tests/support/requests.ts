// Build Requests the way a signed-in browser sends them, and call exported route handlers.
// Every test request is built here (pageRequest), so each carries what a browser on one of the
// app's own pages sends: a change names the page's origin in Origin, as browsers do on every POST.
import { appOrigin } from "@/lib/server/core/origin";
import { SESSION_COOKIE } from "@/lib/server/core/session";
import { openSession } from "@/lib/server/sessions/lifecycle";
import type { TestUser } from "./factories";

/** A cookie for a fresh sign-in of `user` (a live user_sessions row, as the sign-in route opens). */
export async function cookieFor(user: TestUser): Promise<string> {
  const { cookie } = await openSession(user);
  return `${SESSION_COOKIE}=${cookie}`;
}

/**
 * A Request as a browser on one of the app's pages sends it: a change (any method but GET and
 * HEAD) carries the app's Origin unless `init.headers` names another. A header given as "" is
 * not sent at all (a request with no Origin, a body with no type).
 */
export function pageRequest(url: string | URL, init: RequestInit = {}): Request {
  const headers = new Headers(init.headers);
  const method = (init.method ?? "GET").toUpperCase();
  if (!headers.has("origin") && method !== "GET" && method !== "HEAD") headers.set("origin", appOrigin());
  for (const [name, value] of [...headers]) if (value === "") headers.delete(name);
  return new Request(new URL(url, "http://localhost"), { ...init, method, headers });
}

export async function asUser(
  user: TestUser | null,
  method: string,
  url: string,
  body?: unknown,
  headers: Record<string, string> = {},
): Promise<Request> {
  const h: Record<string, string> = { ...headers };
  if (user) h.cookie = await cookieFor(user);
  // A body goes as JSON (a string as it is, to send malformed JSON) unless `headers` names a type.
  let payload: BodyInit | undefined;
  if (body !== undefined) {
    payload = typeof body === "string" ? body : JSON.stringify(body);
    h["content-type"] ??= "application/json";
  }
  return pageRequest(url, { method, headers: h, body: payload });
}

// Route handlers type their params per route; the helper accepts any of them.
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- see above
type RouteHandler = (req: Request, ctx: { params: Promise<any> }) => Promise<Response>;

export async function call(handler: RouteHandler, req: Request, params: Record<string, string> = {}) {
  const res = await handler(req, { params: Promise.resolve(params) });
  const text = await res.text();
  let body: unknown;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    body = text;
  }
  // Tests read bodies of many shapes; `any` keeps each assertion free of casts.
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- see above
  return { status: res.status, headers: res.headers, body: body as any };
}
