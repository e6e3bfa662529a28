import { describe, expect, it } from "vitest";
import { DELETE, POST } from "@/app/api/session/route";
import { GET as me } from "@/app/api/me/route";
import { SIGN_IN_REFUSED } from "@/lib/server/users/sign-in";
import { createShop, TEST_PASSWORD } from "../support/factories";
import { asUser, call, pageRequest } from "../support/requests";

// No trusted proxy here: every request is from the same unknown address (the throttle's own
// rules, with addresses, are in sign-in-throttle.test.ts).
const signIn = (body: unknown) => asUser(null, "POST", "/api/session", body);

describe("POST /api/session", () => {
  it("signs in, sets an httpOnly SameSite=Lax cookie and names the role's home", async () => {
    const { users } = await createShop();
    const res = await call(POST, await signIn({ email: users.inspector.email, password: TEST_PASSWORD }));
    expect(res.status).toBe(200);
    expect(res.body.home).toBe("/release");
    const cookie = res.headers.get("set-cookie") ?? "";
    expect(cookie).toMatch(/^tw_session=/);
    expect(cookie).toContain("HttpOnly");
    expect(cookie).toContain("SameSite=Lax");
  });

  it("gives the same words for a wrong password and an unknown user", async () => {
    const { users } = await createShop();
    const wrong = await call(POST, await signIn({ email: users.lead.email, password: "not-it" }));
    const unknown = await call(POST, await signIn({ email: "nobody@nowhere.example", password: "x" }));
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error).toEqual({ code: "unauthorized", message: SIGN_IN_REFUSED });
  });

  it("locks an account from an address after repeated failures there, even with the right password", async () => {
    const { users } = await createShop();
    for (let i = 0; i < 5; i++) await call(POST, await signIn({ email: users.admin.email, password: "guess" + i }));
    const res = await call(POST, await signIn({ email: users.admin.email, password: TEST_PASSWORD }));
    expect(res.status).toBe(429);
    expect(res.body.error.code).toBe("too_many_attempts");
    expect(res.headers.get("retry-after")).toBeTruthy();
  }, 60_000);

  it("refuses a deactivated account with the same words", async () => {
    const { users } = await createShop();
    const { User } = await import("@/models");
    await User.update({ active: false }, { where: { id: users.machinist.id } });
    const res = await call(POST, await signIn({ email: users.machinist.email, password: TEST_PASSWORD }));
    expect(res.status).toBe(401);
    expect(res.body.error.message).toBe(SIGN_IN_REFUSED);
  });

  it.each([
    ["malformed JSON", "{ not json", 400, "bad_json"],
    ["a missing password", { email: "a@b.example" }, 422, "invalid"],
    ["an e-mail that is not one", { email: "rosa", password: "x" }, 422, "invalid"],
  ])("answers %s with the error envelope", async (_what, body, status, code) => {
    const res = await call(POST, await signIn(body));
    expect(res.status).toBe(status);
    expect(res.body.error.code).toBe(code);
    expect(typeof res.body.error.message).toBe("string");
    if (status === 422) expect(Object.keys(res.body.error.fields).length).toBeGreaterThan(0);
  });

  it("signs out by clearing the cookie", async () => {
    const res = await call(DELETE, await asUser(null, "DELETE", "/api/session"));
    expect(res.status).toBe(204);
    expect(res.headers.get("set-cookie")).toContain("Max-Age=0");
  });
});

describe("sessions end on the server", () => {
  const cookieOf = (res: { headers: Headers }) => (res.headers.get("set-cookie") ?? "").split(";")[0];
  const meWith = async (cookie: string) => call(me, new Request("http://localhost/api/me", { headers: { cookie } }));
  const signOut = async (cookie: string, body?: unknown) =>
    call(
      DELETE,
      pageRequest("/api/session", {
        method: "DELETE",
        headers: body ? { cookie, "content-type": "application/json" } : { cookie },
        body: body ? JSON.stringify(body) : undefined,
      }),
    );

  it("refuses a cookie kept after signing out (a copy of it no longer works)", async () => {
    const { users } = await createShop();
    const cookie = cookieOf(await call(POST, await signIn({ email: users.machinist.email, password: TEST_PASSWORD })));
    expect((await meWith(cookie)).status).toBe(200);
    expect((await signOut(cookie)).status).toBe(204);
    expect((await meWith(cookie)).status).toBe(401);
  });

  it("ends a session named by a tablet that signed out offline, and keeps the next person's cookie", async () => {
    const { users } = await createShop();
    const first = await call(POST, await signIn({ email: users.machinist.email, password: TEST_PASSWORD }));
    const second = await call(POST, await signIn({ email: users.lead.email, password: TEST_PASSWORD }));
    const res = await signOut(cookieOf(second), { sessionId: first.body.sessionId });
    expect(res.status).toBe(204);
    expect(res.headers.get("set-cookie")).toBeNull();
    expect((await meWith(cookieOf(first))).status).toBe(401);
    expect((await meWith(cookieOf(second))).status).toBe(200);
  });

  it("refuses a session id that is not one with words", async () => {
    const res = await signOut("", { sessionId: "../../etc" });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.sessionId).toEqual(["A session id is 32 hexadecimal characters"]);
  });

  it("ends the session a browser still carried when someone else signs in on it", async () => {
    const { users } = await createShop();
    const a = await call(POST, await signIn({ email: users.machinist.email, password: TEST_PASSWORD }));
    const b = await call(
      POST,
      await asUser(
        null,
        "POST",
        "/api/session",
        { email: users.lead.email, password: TEST_PASSWORD },
        { cookie: cookieOf(a) },
      ),
    );
    expect(b.status).toBe(200);
    expect((await meWith(cookieOf(a))).status).toBe(401);
    const who = await meWith(cookieOf(b));
    expect(who.body.user.id).toBe(users.lead.id);
    expect(who.body.sessionId).toBe(b.body.sessionId);
  });

  it("refuses a cookie sealed without a session (from before sessions had rows)", async () => {
    const { users } = await createShop();
    const { sealSession, SESSION_COOKIE } = await import("@/lib/server/core/session");
    const old = { userId: users.lead.id, shopId: users.lead.shopId, role: "lead", name: "x", issuedAt: Date.now() };
    const sealed = await sealSession(old as never);
    expect((await meWith(`${SESSION_COOKIE}=${sealed}`)).status).toBe(401);
  });
});

describe("GET /api/me", () => {
  it("is 401 with the envelope when signed out", async () => {
    const res = await call(me, await asUser(null, "GET", "/api/me"));
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ error: { code: "unauthorized", message: "Sign in first" } });
  });

  it("tells who is signed in and their shop", async () => {
    const { users, shop } = await createShop();
    const res = await call(me, await asUser(users.lead, "GET", "/api/me"));
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ id: users.lead.id, role: "lead" });
    expect(res.body.shop).toMatchObject({ id: shop.id });
  });

  it("refuses a sealed cookie of a user who was deactivated since", async () => {
    const { users } = await createShop();
    const req = await asUser(users.lead, "GET", "/api/me");
    const { User } = await import("@/models");
    await User.update({ active: false }, { where: { id: users.lead.id } });
    expect((await call(me, req)).status).toBe(401);
  });
});
