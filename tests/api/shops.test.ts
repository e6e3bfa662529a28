// Starting a shop from the public page: the shop, its admin and starter sheets made at once but
// closed until the e-mailed link is opened; expired links sent again; duplicates answered in words;
// the whole page switched off by PUBLIC_SIGNUP.
import { randomUUID } from "node:crypto";
import { afterEach, describe, expect, it } from "vitest";
import { POST as START } from "@/app/api/shops/route";
import { POST as VERIFY } from "@/app/api/shops/verify/route";
import { POST as RESEND } from "@/app/api/shops/resend/route";
import { POST as SIGN_IN } from "@/app/api/session/route";
import { GET as SPECS } from "@/app/api/specs/route";
import { env } from "@/lib/server/core/env";
import { AuditEvent, LinkToken, Shop, SpecLimit, SpecTemplate, User } from "@/models";
import { createShop as createTestShop } from "../support/factories";
import { linkToken, waitForMails } from "../support/mailbox";
import { asUser, call } from "../support/requests";

const PASSWORD = "crank-journal-harbour-57";
const post = async (handler: unknown, url: string, body: unknown) =>
  call(handler as never, await asUser(null, "POST", url, body));

function signUp(over: Record<string, unknown> = {}) {
  const tag = randomUUID().slice(0, 8);
  const body = {
    shopName: `Ridge Line Machine ${tag}`,
    unitSystem: "in",
    adminName: "Nell Ostrander",
    email: `nell-${tag}@ridge.example`,
    password: PASSWORD,
    ...over,
  };
  return { body, res: post(START, "/api/shops", body) };
}

const signIn = (email: string, password = PASSWORD) => post(SIGN_IN, "/api/session", { email, password });

afterEach(() => {
  env().PUBLIC_SIGNUP = "on";
});

describe("POST /api/shops (start a shop)", () => {
  it("makes a closed shop with its admin and three marked starter sheets, opened by the e-mailed link", async () => {
    const { body, res } = signUp();
    const started = await res;
    expect(started.status).toBe(201);
    const shop = (await Shop.findOne({ where: { name: body.shopName } }))!;
    expect(shop.activatedAt).toBeNull();
    const admin = (await User.findOne({ where: { shopId: shop.id } }))!;
    expect(admin).toMatchObject({ role: "admin", email: body.email, name: body.adminName });
    expect(admin.passwordHash).not.toContain(PASSWORD);
    const sheets = await SpecTemplate.findAll({ where: { shopId: shop.id } });
    expect(sheets).toHaveLength(3);
    const limits = await SpecLimit.findAll({ where: { templateId: sheets.map((s) => s.id) } });
    expect(limits.length).toBeGreaterThan(50);
    expect(limits.every((l) => l.commonPractice)).toBe(true);

    // Closed: the right password is refused with words, and a new link goes out.
    const early = await signIn(body.email);
    expect(early.status).toBe(403);
    expect(early.body.error.message).toContain("opens once you confirm your e-mail address");

    const mails = await waitForMails(body.email, 2);
    expect(mails[0].subject).toBe(`Confirm your e-mail to open ${body.shopName} in Tenthwise`);
    const stale = linkToken(mails[0], "/start/confirm");
    const fresh = linkToken(mails[1], "/start/confirm");
    // The sign-in's new link replaced the first one.
    expect((await post(VERIFY, "/api/shops/verify", { token: stale })).status).toBe(410);

    const opened = await post(VERIFY, "/api/shops/verify", { token: fresh });
    expect(opened.status).toBe(200);
    expect(opened.body).toEqual({ shopName: body.shopName, home: "/desk" });
    expect(opened.headers.get("set-cookie")).toMatch(/HttpOnly/i);
    expect((await Shop.findByPk(shop.id))!.activatedAt).not.toBeNull();
    expect((await signIn(body.email)).status).toBe(200);
    const again = await post(VERIFY, "/api/shops/verify", { token: fresh });
    expect(again.status).toBe(410);
    expect(again.body.error.message).toContain("already been used");
    const actions = (await AuditEvent.findAll({ where: { shopId: shop.id } })).map((e) => e.action);
    expect(actions).toEqual(expect.arrayContaining(["shop.create", "shop.activate"]));
  }, 60_000);

  it("refuses an expired link in words and sends a new one on request, the same answer for any address", async () => {
    const { body, res } = signUp({ unitSystem: "mm" });
    expect((await res).status).toBe(201);
    const [first] = await waitForMails(body.email, 1);
    const admin = (await User.findOne({ where: { email: body.email } }))!;
    await LinkToken.update({ expiresAt: new Date(Date.now() - 60_000) }, { where: { userId: admin.id } });
    const expired = await post(VERIFY, "/api/shops/verify", { token: linkToken(first, "/start/confirm") });
    expect(expired.status).toBe(410);
    expect(expired.body.error.message).toContain("This link has expired");

    const resent = await post(RESEND, "/api/shops/resend", { email: body.email.toUpperCase() });
    const nobody = await post(RESEND, "/api/shops/resend", { email: `nobody-${randomUUID()}@ridge.example` });
    expect(resent.status).toBe(202);
    expect(nobody.status).toBe(202);
    const mails = await waitForMails(body.email, 2);
    const opened = await post(VERIFY, "/api/shops/verify", { token: linkToken(mails[1], "/start/confirm") });
    expect(opened.status).toBe(200);
    expect((await Shop.findOne({ where: { name: body.shopName } }))!.unitSystem).toBe("mm");
  }, 60_000);

  it("answers a shop name already in use with words naming the field, and makes nothing", async () => {
    const { body, res } = signUp();
    expect((await res).status).toBe(201);
    const before = await Shop.count();
    const sameName = await signUp({ shopName: body.shopName.toUpperCase() }).res;
    expect(sameName.status).toBe(409);
    expect(sameName.body.error.fields.shopName[0]).toContain("is taken");
    expect(await Shop.count()).toBe(before);
  });

  it("answers an address that already has an account as it would a new one, and tells its owner by mail", async () => {
    const existing = await createTestShop();
    const before = await Shop.count();
    const fresh = signUp();
    const taken = signUp({ email: existing.users.lead.email.toUpperCase() });
    const [freshRes, takenRes] = [await fresh.res, await taken.res];
    expect(takenRes.status).toBe(freshRes.status);
    expect(Object.keys(takenRes.body).sort()).toEqual(Object.keys(freshRes.body).sort());
    expect(await Shop.count()).toBe(before + 1);
    const [notice] = await waitForMails(existing.users.lead.email, 1);
    expect(notice.subject).toContain("tried to start a Tenthwise shop");
  });

  it("refuses a short password or one that is the person's own e-mail, keeping the field named", async () => {
    const short = await signUp({ password: "piston" }).res;
    expect(short.status).toBe(422);
    expect(short.body.error.fields.password[0]).toMatch(/at least/);
    const tag = randomUUID().slice(0, 8);
    const own = await signUp({ email: `own-${tag}@ridge.example`, password: `own-${tag}@ridge.example` }).res;
    expect(own.status).toBe(422);
    expect(own.body.error.fields.password).toBeDefined();
    const missing = await post(START, "/api/shops", { shopName: "", unitSystem: "cm" });
    expect(missing.status).toBe(422);
    expect(Object.keys(missing.body.error.fields)).toEqual(
      expect.arrayContaining(["shopName", "unitSystem", "adminName", "email", "password"]),
    );
  });

  it("with PUBLIC_SIGNUP=off refuses to start a shop or send links, in words", async () => {
    env().PUBLIC_SIGNUP = "off";
    const { body, res } = signUp();
    const refused = await res;
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toContain("does not take new shops from the public page");
    expect(await Shop.count({ where: { name: body.shopName } })).toBe(0);
    expect((await post(RESEND, "/api/shops/resend", { email: body.email })).status).toBe(403);
  });

  it("keeps each new shop's sheets to itself", async () => {
    const a = signUp();
    const b = signUp();
    await Promise.all([a.res, b.res]);
    for (const s of [a, b]) {
      const [mail] = await waitForMails(s.body.email, 1);
      expect((await post(VERIFY, "/api/shops/verify", { token: linkToken(mail, "/start/confirm") })).status).toBe(200);
    }
    const adminA = (await User.findOne({ where: { email: a.body.email } }))!;
    const adminB = (await User.findOne({ where: { email: b.body.email } }))!;
    const asA = {
      id: adminA.id,
      shopId: adminA.shopId,
      role: "admin" as const,
      name: adminA.name,
      email: adminA.email,
    };
    const seen = await call(SPECS as never, await asUser(asA, "GET", "/api/specs"));
    const ids: number[] = seen.body.templates.map((t: { id: number }) => t.id);
    const ofB = (await SpecTemplate.findAll({ where: { shopId: adminB.shopId } })).map((t) => t.id);
    expect(ids).toHaveLength(3);
    expect(ids.some((id) => ofB.includes(id))).toBe(false);
  }, 60_000);
});
