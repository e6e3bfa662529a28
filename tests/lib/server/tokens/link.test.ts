import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";

// tokenLink reads APP_URL through the validated environment, so each case loads the module afresh.
const BASE_ENV = { SESSION_SECRET: "x".repeat(40), DB_HOST: "127.0.0.1", DB_NAME: "tw", DB_USER: "tw" };

async function linkWith(appUrl: string, path: string, token: string) {
  vi.resetModules();
  vi.stubEnv("APP_URL", appUrl);
  const { tokenLink } = await import("@/lib/server/tokens/service");
  return tokenLink(path, token);
}

describe("tokenLink", () => {
  beforeEach(() => {
    for (const [k, v] of Object.entries(BASE_ENV)) vi.stubEnv(k, v);
  });
  afterEach(() => vi.unstubAllEnvs());

  it("puts the token as the last path segment under APP_URL", async () => {
    expect(await linkWith("https://shop.example", "/set-password", "abc_-9")).toBe(
      "https://shop.example/set-password/abc_-9",
    );
  });

  it("joins without doubled or missing slashes", async () => {
    expect(await linkWith("https://shop.example/app/", "reset-password/", "t")).toBe(
      "https://shop.example/app/reset-password/t",
    );
  });
});

describe("tokenProblemWords", () => {
  it("says what to do instead for each purpose", async () => {
    const { tokenProblemWords } = await import("@/lib/server/tokens/service");
    expect(tokenProblemWords("set_password", "expired")).toMatch(/admin to send the invitation again/);
    expect(tokenProblemWords("reset_password", "used")).toMatch(/works once.*Forgot password/);
    expect(tokenProblemWords("verify_email", "unknown")).toMatch(/new confirmation message/);
    expect(tokenProblemWords("set_password", "replaced")).toMatch(/latest message/);
  });
});
