import "server-only";
import { env } from "@/lib/server/core/env";
import { AppError } from "@/lib/server/core/errors";

// A page on another site can make a browser send a form or a fetch to us with the user's cookie;
// SameSite=Lax keeps most of them out, but not a same-site page, an older browser or a proxy that
// rewrites cookies. So a request that changes anything must say it came from one of our own pages.
const READ_ONLY_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/** The app's own origin (APP_URL's), the one its pages send changes from. */
export const appOrigin = () => new URL(env().APP_URL).origin;

/** The origins whose pages may change data: the app's own and those listed in ALLOWED_ORIGINS. */
export const allowedOrigins = (): string[] => [appOrigin(), ...env().ALLOWED_ORIGINS];

/** The origin a request says it was sent from: Origin, or Referer's origin when Origin is absent. */
function senderOf(req: Request): { origin: string | null; said: string | null } {
  const origin = req.headers.get("origin");
  if (origin !== null) return { origin: origin === "null" ? null : originOf(origin), said: origin };
  const referer = req.headers.get("referer");
  return { origin: referer ? originOf(referer) : null, said: referer };
}

function originOf(url: string): string | null {
  try {
    const origin = new URL(url).origin;
    return origin === "null" ? null : origin;
  } catch {
    return null;
  }
}

/** 403 unless a state-changing request came from one of our own pages; reads pass untouched. */
export function requireOwnOrigin(req: Request): void {
  if (READ_ONLY_METHODS.has(req.method.toUpperCase())) return;
  const { origin, said } = senderOf(req);
  if (said === null) {
    throw new AppError(
      "forbidden",
      "This request did not say which site sent it (no Origin or Referer header), so nothing was changed. " +
        "Changes are accepted only from Tenthwise's own pages.",
    );
  }
  if (origin === null || !allowedOrigins().includes(origin)) {
    throw new AppError(
      "forbidden",
      `This request came from ${origin ?? "a page with no address"}, not from Tenthwise's own pages, so nothing ` +
        "was changed. If Tenthwise is reached through another address (a reverse proxy), an admin adds that " +
        "address to ALLOWED_ORIGINS.",
    );
  }
}
