import { describe, expect, it } from "vitest";
import { contentSecurityPolicy, newNonce, referrerPolicy, securityHeaders } from "@/lib/security-headers";

const policy = (o: { dev?: boolean; https?: boolean } = {}) =>
  contentSecurityPolicy({ nonce: "abc", dev: o.dev ?? false, https: o.https ?? false });
const directive = (csp: string, name: string) => csp.split("; ").find((d) => d.startsWith(`${name} `));

describe("the Content-Security-Policy", () => {
  it("runs scripts by nonce only in production, with no inline or eval allowance", () => {
    expect(directive(policy(), "script-src")).toBe("script-src 'self' 'nonce-abc' 'strict-dynamic'");
    expect(policy()).not.toContain("unsafe-");
  });

  it("allows eval and inline styles in development only (React's error stacks, the dev overlay)", () => {
    expect(directive(policy({ dev: true }), "script-src")).toContain("'unsafe-eval'");
    expect(directive(policy({ dev: true }), "style-src")).toBe("style-src 'self' 'unsafe-inline'");
    expect(directive(policy(), "style-src")).toBe("style-src 'self' 'nonce-abc'");
  });

  it("lets nothing frame a page, keeps workers, photos and previews working", () => {
    const csp = policy();
    expect(directive(csp, "frame-ancestors")).toBe("frame-ancestors 'none'");
    expect(directive(csp, "worker-src")).toBe("worker-src 'self'");
    expect(directive(csp, "img-src")).toBe("img-src 'self' blob: data:");
    expect(directive(csp, "object-src")).toBe("object-src 'none'");
  });

  it("upgrades requests to https only when the app is served over https", () => {
    expect(policy()).not.toContain("upgrade-insecure-requests");
    expect(policy({ https: true })).toContain("upgrade-insecure-requests");
  });
});

describe("the other headers", () => {
  const headers = (path: string, https = false) => securityHeaders({ nonce: "abc", path, dev: false, https });

  it("always says nosniff and DENY", () => {
    expect(headers("/desk")).toMatchObject({ "X-Content-Type-Options": "nosniff", "X-Frame-Options": "DENY" });
  });

  it("sends no referrer from a customer's record link (its token is in the path), the origin elsewhere", () => {
    expect(referrerPolicy("/r/abc.def")).toBe("no-referrer");
    expect(referrerPolicy("/api/r/abc.def/pdf")).toBe("no-referrer");
    expect(referrerPolicy("/release/12")).toBe("strict-origin-when-cross-origin");
    expect(referrerPolicy("/rules")).toBe("strict-origin-when-cross-origin");
  });

  it("asks for HSTS only over https", () => {
    expect(headers("/desk")["Strict-Transport-Security"]).toBeUndefined();
    expect(headers("/desk", true)["Strict-Transport-Security"]).toMatch(/^max-age=\d{7,}/);
  });

  it("makes a fresh 128-bit nonce each time", () => {
    const a = newNonce();
    expect(atob(a)).toHaveLength(16);
    expect(newNonce()).not.toBe(a);
  });
});
