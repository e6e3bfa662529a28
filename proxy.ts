import { NextResponse, type NextRequest } from "next/server";
import { PAGE_PATH_HEADER } from "@/lib/nav";

// The office pages' layout sends a signed-out visitor to the sign-in page, which then leads back to
// the page asked for. A layout cannot see the URL (it is not re-rendered on navigation), so this
// hands the path on in a request header; it decides nothing and refuses nothing itself.
export function proxy(req: NextRequest) {
  const headers = new Headers(req.headers);
  headers.set(PAGE_PATH_HEADER, `${req.nextUrl.pathname}${req.nextUrl.search}`);
  return NextResponse.next({ request: { headers } });
}

export const config = { matcher: ["/desk/:path*", "/release/:path*", "/admin/:path*", "/audit/:path*"] };
