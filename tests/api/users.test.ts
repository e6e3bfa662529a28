// Admin user management: invite, role, deactivate/reactivate, password reset — every role, other
// shops' ids, bad bodies, the own-account and last-admin rules, and what the audit keeps.
import { beforeAll, describe, expect, it } from "vitest";
import { GET, POST } from "@/app/api/users/route";
import { PATCH } from "@/app/api/users/[userId]/route";
import { POST as RESET } from "@/app/api/users/[userId]/password/route";
import { POST as SIGN_IN } from "@/app/api/session/route";
import { GET as ME } from "@/app/api/me/route";
import bcrypt from "bcryptjs";
import { AuditEvent, MailOutbox, User } from "@/models";
import { createShop, TEST_PASSWORD, type TestShop, type TestUser } from "../support/factories";
import { asUser, call, cookieFor, pageRequest } from "../support/requests";

const ROLES = ["machinist", "lead", "inspector", "admin"] as const;
let a: TestShop;
let b: TestShop;

beforeAll(async () => {
  a = await createShop();
  b = await createShop();
});

async function signInWith(email: string, password: string) {
  return call(
    SIGN_IN as never,
    pageRequest("/api/session", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ email, password }),
    }),
  );
}

async function invite(by: TestUser, body: unknown) {
  return call(POST as never, await asUser(by, "POST", "/api/users", body));
}

async function patch(by: TestUser, id: number | string, body: unknown) {
  return call(PATCH as never, await asUser(by, "PATCH", `/api/users/${id}`, body), { userId: String(id) });
}

const fresh = (tag: string) => ({
  name: `New ${tag}`,
  email: `new-${tag}-${Date.now()}@test.example`,
  role: "machinist",
});

describe("GET /api/users", () => {
  it.each(ROLES)("as %s", async (role) => {
    const res = await call(GET as never, await asUser(a.users[role], "GET", "/api/users"));
    expect(res.status).toBe(role === "admin" ? 200 : 403);
    if (role !== "admin") return;
    const emails = res.body.users.map((u: { email: string }) => u.email);
    expect(emails).toContain(a.users.lead.email);
    expect(emails).not.toContain(b.users.lead.email);
    expect(JSON.stringify(res.body)).not.toMatch(/password/i);
  });

  it("refuses the signed-out with 401", async () => {
    expect((await call(GET as never, await asUser(null, "GET", "/api/users"))).status).toBe(401);
  });
});

describe("POST /api/users (invite)", () => {
  it.each(ROLES.filter((r) => r !== "admin"))("refuses %s with 403", async (role) => {
    expect((await invite(a.users[role], fresh(role))).status).toBe(403);
  });

  it("creates the account, queues the invitation, shows no password, and audits no secret", async () => {
    const body = { ...fresh("ok"), email: `Mixed.Case-${Date.now()}@Test.Example` };
    const res = await invite(a.users.admin, body);
    expect(res.status).toBe(201);
    const { user } = res.body;
    expect(user).toMatchObject({ name: body.name, email: body.email.toLowerCase(), role: "machinist", active: true });
    expect(res.body.invitationSentTo).toBe(body.email.toLowerCase());
    expect(res.body.temporaryPassword).toBeUndefined();
    expect(await MailOutbox.count({ where: { toAddress: body.email.toLowerCase(), kind: "invitation" } })).toBe(1);

    const audit = await AuditEvent.findAll({
      where: { shopId: a.shop.id, entityType: "user", entityId: String(user.id) },
    });
    expect(audit.map((e) => e.action)).toEqual(["user.invited"]);
    const row = await User.findByPk(user.id);
    const trail = JSON.stringify(audit.map((e) => e.get({ plain: true })));
    expect(trail).not.toContain(row!.passwordHash);
  });

  it("refuses an e-mail that already has an account in the shop (409, any letter case)", async () => {
    const res = await invite(a.users.admin, { name: "Twin", email: a.users.lead.email.toUpperCase(), role: "lead" });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.email).toBeDefined();
  });

  it("allows the same e-mail in another shop", async () => {
    const res = await invite(b.users.admin, {
      name: "Same address",
      email: a.users.inspector.email,
      role: "inspector",
    });
    expect(res.status).toBe(201);
  });

  it.each([
    ["no name", { email: "x@test.example", role: "lead" }, "name"],
    ["blank name", { name: "  ", email: "x@test.example", role: "lead" }, "name"],
    ["bad e-mail", { name: "X", email: "not-an-email", role: "lead" }, "email"],
    ["unknown role", { name: "X", email: "x@test.example", role: "owner" }, "role"],
  ])("422 for %s, naming the field", async (_label, body, field) => {
    const res = await invite(a.users.admin, body);
    expect(res.status).toBe(422);
    expect(res.body.error.fields[field]?.[0]).toBeTruthy();
  });

  it("400 for a body that is not JSON", async () => {
    expect((await invite(a.users.admin, "{nope")).status).toBe(400);
  });
});

describe("PATCH /api/users/[userId]", () => {
  it.each(ROLES.filter((r) => r !== "admin"))("refuses %s with 403", async (role) => {
    expect((await patch(a.users[role], a.users.machinist.id, { role: "lead" })).status).toBe(403);
  });

  it("404 for another shop's user and for a junk id", async () => {
    expect((await patch(a.users.admin, b.users.machinist.id, { role: "lead" })).status).toBe(404);
    expect((await patch(a.users.admin, "abc", { role: "lead" })).status).toBe(404);
  });

  it.each([
    ["nothing to change", {}],
    ["an unknown role", { role: "owner" }],
    ["active as text", { active: "no" }],
    ["an unknown field", { password: "x" }],
  ])("422 for %s", async (_label, body) => {
    const res = await patch(a.users.admin, a.users.machinist.id, body);
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).length).toBeGreaterThan(0);
  });

  it("changes a role and audits before and after", async () => {
    const { body } = await invite(a.users.admin, fresh("role"));
    const res = await patch(a.users.admin, body.user.id, { role: "inspector" });
    expect(res.status).toBe(200);
    expect(res.body.user.role).toBe("inspector");
    const e = await AuditEvent.findOne({
      where: { entityType: "user", entityId: String(body.user.id), action: "user.role_changed" },
    });
    expect(e?.before).toMatchObject({ role: "machinist" });
    expect(e?.after).toMatchObject({ role: "inspector" });
  });

  it("keeps the last active admin: demoting or deactivating them is 409 with words", async () => {
    const c = await createShop();
    const only = c.users.admin;
    for (const change of [{ role: "lead" }, { active: false }]) {
      const res = await patch(only, only.id, change);
      expect(res.status).toBe(409);
      expect(res.body.error.message).toMatch(/last active admin/);
    }
    expect(await User.findByPk(only.id)).toMatchObject({ role: "admin", active: true });
  });

  it("with two admins: own role 403, own account 409, the other one may be demoted", async () => {
    const c = await createShop();
    const { body } = await invite(c.users.admin, {
      name: "Second admin",
      email: `second-${Date.now()}@test.example`,
      role: "admin",
    });
    expect((await patch(c.users.admin, c.users.admin.id, { role: "lead" })).status).toBe(403);
    const own = await patch(c.users.admin, c.users.admin.id, { active: false });
    expect(own.status).toBe(409);
    expect(own.body.error.message).toMatch(/your own account/);
    expect((await patch(c.users.admin, body.user.id, { role: "lead" })).status).toBe(200);
  });

  it("two admins switching each other off at once: exactly one succeeds, one admin remains", async () => {
    const c = await createShop();
    const { body } = await invite(c.users.admin, {
      name: "Rival admin",
      email: `rival-${Date.now()}@test.example`,
      role: "admin",
    });
    const rival: TestUser = {
      id: body.user.id,
      shopId: c.shop.id,
      role: "admin",
      name: "Rival admin",
      email: body.user.email,
    };
    const [x, y] = await Promise.all([
      patch(c.users.admin, rival.id, { active: false }),
      patch(rival, c.users.admin.id, { active: false }),
    ]);
    // The loser is refused either inside the transaction (409) or, when the winner committed before
    // the loser's request was checked, as already switched off with their sessions ended (401).
    const [won, lost] = [x.status, y.status].sort();
    expect(won).toBe(200);
    expect([401, 409]).toContain(lost);
    expect(await User.count({ where: { shopId: c.shop.id, role: "admin", active: true } })).toBe(1);
  });

  it("a deactivated person cannot sign in, and signs in again once reactivated", async () => {
    const { body } = await invite(a.users.admin, fresh("off"));
    await User.update({ passwordHash: bcrypt.hashSync(TEST_PASSWORD, 4) }, { where: { id: body.user.id } });
    expect((await patch(a.users.admin, body.user.id, { active: false })).status).toBe(200);
    expect((await signInWith(body.user.email, TEST_PASSWORD)).status).toBe(401);
    expect((await patch(a.users.admin, body.user.id, { active: true })).status).toBe(200);
    expect((await signInWith(body.user.email, TEST_PASSWORD)).status).toBe(200);
    const actions = (
      await AuditEvent.findAll({
        where: { entityType: "user", entityId: String(body.user.id) },
        order: [["id", "ASC"]],
      })
    ).map((e) => e.action);
    expect(actions).toEqual(["user.invited", "user.deactivated", "user.reactivated"]);
  });
});

describe("changing an account ends its other sessions", () => {
  const meAs = async (cookie: string) =>
    call(ME as never, new Request("http://localhost/api/me", { headers: { cookie } }));
  const reset = async (by: TestUser, id: number, cookie?: string) =>
    call(
      RESET as never,
      await asUser(cookie ? null : by, "POST", `/api/users/${id}/password`, undefined, { cookie: cookie ?? "" }),
      {
        userId: String(id),
      },
    );

  it("a role change signs the person out everywhere; the audit says how many sessions ended", async () => {
    const { body } = await invite(a.users.admin, fresh("role-out"));
    const tablet = await cookieFor({ ...body.user, shopId: a.shop.id });
    const office = await cookieFor({ ...body.user, shopId: a.shop.id });
    expect((await meAs(tablet)).status).toBe(200);
    expect((await patch(a.users.admin, body.user.id, { role: "lead" })).status).toBe(200);
    expect((await meAs(tablet)).status).toBe(401);
    expect((await meAs(office)).status).toBe(401);
    const e = await AuditEvent.findOne({
      where: { entityType: "user", entityId: String(body.user.id), action: "user.role_changed" },
    });
    expect(e?.after).toMatchObject({ role: "lead", sessionsEnded: 2 });
  });

  it("a password reset ends the person's sessions; the new password opens a fresh one", async () => {
    const { body } = await invite(a.users.admin, fresh("reset-out"));
    const before = await cookieFor({ ...body.user, shopId: a.shop.id });
    const res = await reset(a.users.admin, body.user.id);
    expect(res.status).toBe(200);
    expect((await meAs(before)).status).toBe(401);
    const again = await signInWith(body.user.email, res.body.temporaryPassword);
    expect(again.status).toBe(200);
    expect((await meAs((again.headers.get("set-cookie") ?? "").split(";")[0])).status).toBe(200);
  });

  it("an admin resetting their own password keeps the session they use and ends their others", async () => {
    const admin = a.users.admin;
    const using = await cookieFor(admin);
    const elsewhere = await cookieFor(admin);
    const res = await reset(admin, admin.id, using);
    expect(res.status).toBe(200);
    expect((await meAs(using)).status).toBe(200);
    expect((await meAs(elsewhere)).status).toBe(401);
  });

  it("a reactivation does not bring an ended session back", async () => {
    const { body } = await invite(a.users.admin, fresh("off-on"));
    const cookie = await cookieFor({ ...body.user, shopId: a.shop.id });
    await patch(a.users.admin, body.user.id, { active: false });
    await patch(a.users.admin, body.user.id, { active: true });
    expect((await meAs(cookie)).status).toBe(401);
  });
});

describe("POST /api/users/[userId]/password", () => {
  const reset = async (by: TestUser, id: number) =>
    call(RESET as never, await asUser(by, "POST", `/api/users/${id}/password`), { userId: String(id) });

  it.each(ROLES.filter((r) => r !== "admin"))("refuses %s with 403", async (role) => {
    expect((await reset(a.users[role], a.users.machinist.id)).status).toBe(403);
  });

  it("404 for another shop's user", async () => {
    expect((await reset(a.users.admin, b.users.machinist.id)).status).toBe(404);
  });

  it("replaces the password: the new one signs in, the old one no longer does; audit holds no secret", async () => {
    const target = a.users.inspector;
    expect((await signInWith(target.email, TEST_PASSWORD)).status).toBe(200);
    const res = await reset(a.users.admin, target.id);
    expect(res.status).toBe(200);
    expect((await signInWith(target.email, TEST_PASSWORD)).status).toBe(401);
    const signedIn = await signInWith(target.email, res.body.temporaryPassword);
    expect([signedIn.status, signedIn.body.mustChangePassword]).toEqual([200, true]);
    const e = await AuditEvent.findOne({
      where: { entityType: "user", entityId: String(target.id), action: "user.password_reset" },
    });
    expect(e).not.toBeNull();
    expect(JSON.stringify(e!.get({ plain: true }))).not.toContain(res.body.temporaryPassword);
  });

  it("refuses a deactivated account with 409", async () => {
    const { body } = await invite(a.users.admin, fresh("reset-off"));
    await patch(a.users.admin, body.user.id, { active: false });
    const res = await reset(a.users.admin, body.user.id);
    expect(res.status).toBe(409);
  });
});
