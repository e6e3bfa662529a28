import { NextResponse, type NextRequest } from "next/server";
import { PAGE_PATH_HEADER } from "@/lib/nav";
import { NONCE_HEADER, newNonce, securityHeaders } from "@/lib/security-headers";
import { env, servedOverHttps } from "@/lib/server/core/env";

const OFFICE_PAGE = /^\/(desk|release|admin|audit|account)(\/|$)/;

// Runs on every request (no matcher), so pages, API answers, static files, errors and 404s all
// carry the security headers. Each request gets a fresh script nonce: Next reads it from the
// request's Content-Security-Policy and puts it on its own scripts, the root layout reads it from
// NONCE_HEADER for the theme script. The office pages' layout sends a signed-out visitor to the
// sign-in page, which then leads back to the page asked for; a layout cannot see the URL (it is
// not re-rendered on navigation), so the path is handed on in PAGE_PATH_HEADER. The proxy refuses
// nothing itself: the origin check lives in the route wrappers (lib/server/core/route.ts).
export function proxy(req: NextRequest) {
  const path = req.nextUrl.pathname;
  const nonce = newNonce();
  const headers = securityHeaders({ nonce, path, dev: env().NODE_ENV === "development", https: servedOverHttps() });
  const forward = new Headers(req.headers);
  forward.set("Content-Security-Policy", headers["Content-Security-Policy"]);
  forward.set(NONCE_HEADER, nonce);
  if (OFFICE_PAGE.test(path)) forward.set(PAGE_PATH_HEADER, `${path}${req.nextUrl.search}`);
  const res = NextResponse.next({ request: { headers: forward } });
  for (const [name, value] of Object.entries(headers)) res.headers.set(name, value);
  return res;
}
