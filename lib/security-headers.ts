// The headers every response carries (proxy.ts sets them on pages, API answers, static files,
// errors and 404s alike). Pure: the proxy says whether this is development and whether the app is
// served over https in production (servedOverHttps, the rule the session cookie's Secure flag follows).

export type SecurityOptions = { nonce: string; path: string; dev: boolean; https: boolean };

/** The request header that hands the nonce to the root layout (for the theme script). */
export const NONCE_HEADER = "x-nonce";

/** 128 random bits, base64: a fresh one per request, so a script injected into a page cannot guess it. */
export function newNonce(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return btoa(String.fromCharCode(...bytes));
}

/**
 * Scripts run only when they carry this request's nonce (Next puts it on its own scripts and the
 * root layout on the theme script) or when such a script loaded them ('strict-dynamic', which the
 * framework's chunk loading needs). Styles are the built CSS files and Next's own nonced tags;
 * photos and previews are blob:/data: URLs; the service worker is /sw.js; nothing may frame a page.
 */
export function contentSecurityPolicy({ nonce, dev, https }: Omit<SecurityOptions, "path">): string {
  const directives = [
    "default-src 'self'",
    // React rebuilds server error stacks with eval in development only.
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    // The development overlay injects styles; a browser ignores 'unsafe-inline' next to a nonce.
    dev ? "style-src 'self' 'unsafe-inline'" : `style-src 'self' 'nonce-${nonce}'`,
    "img-src 'self' blob: data:",
    "font-src 'self'",
    "connect-src 'self'",
    // 'strict-dynamic' drops 'self' from script-src, which workers would fall back to.
    "worker-src 'self'",
    "manifest-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    // Only over https: on a shop's plain-http address it would send every file to a port that is not there.
    ...(https ? ["upgrade-insecure-requests"] : []),
  ];
  return directives.join("; ");
}

// A customer's record link carries its token in the path: nothing under it tells any site, ours
// included, where the visitor came from (the page asks the same in its own <meta name="referrer">).
const TOKEN_PATHS = [/^\/r\//, /^\/api\/r\//];

export function referrerPolicy(path: string): string {
  return TOKEN_PATHS.some((p) => p.test(path)) ? "no-referrer" : "strict-origin-when-cross-origin";
}

/** Every header but the policy's request copy; HSTS only where the app is served over https in production. */
export function securityHeaders(o: SecurityOptions): Record<string, string> {
  return {
    "Content-Security-Policy": contentSecurityPolicy(o),
    "X-Content-Type-Options": "nosniff",
    "Referrer-Policy": referrerPolicy(o.path),
    // Older browsers that do not read frame-ancestors.
    "X-Frame-Options": "DENY",
    ...(o.https ? { "Strict-Transport-Security": "max-age=31536000; includeSubDomains" } : {}),
  };
}
