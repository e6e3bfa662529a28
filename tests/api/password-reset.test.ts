// "Forgot password": the same answer whether or not the address has an account, a link only to
// a real one, throttled per address typed, and a reset that ends every session of the person.
import { describe, expect, it } from "vitest";
import { POST as forgot } from "@/app/api/password/forgot/route";
import { POST as reset } from "@/app/api/password/reset/route";
import { GET as me } from "@/app/api/me/route";
import { POST as signIn } from "@/app/api/session/route";
import { FORGOT_ANSWER } from "@/lib/server/accounts/forgot";
import { MailOutbox } from "@/models";
import { createShop, TEST_PASSWORD } from "../support/factories";
import { linkIn, waitForMails } from "../support/mailbox";
import { deliverFor } from "../support/record-fixtures";
import { asUser, call, cookieFor, pageRequest } from "../support/requests";

const ask = async (email: string, ip: string) =>
  call(forgot, await asUser(null, "POST", "/api/password/forgot", { email }, { "x-forwarded-for": ip }));

const meWith = async (cookie: string) => call(me, pageRequest("/api/me", { headers: { cookie } }));

describe("forgot password", () => {
  it("answers an unknown address exactly as a known one, and mails only the real account", async () => {
    const { shop, users } = await createShop();
    const known = await ask(users.lead.email.toUpperCase(), "10.20.0.1");
    const unknown = await ask(`nobody-${shop.id}@test.example`, "10.20.0.2");
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
    expect(known.body).toEqual({ message: FORGOT_ANSWER });
    expect(await MailOutbox.count({ where: { toAddress: `nobody-${shop.id}@test.example` } })).toBe(0);
    expect(await MailOutbox.count({ where: { toAddress: users.lead.email, kind: "password_reset" } })).toBe(1);
  });

  it("throttles requests for one address, known or not, with Retry-After", async () => {
    const { shop, users } = await createShop();
    for (const email of [users.inspector.email, `ghost-${shop.id}@test.example`]) {
      for (let i = 0; i < 3; i++) expect((await ask(email, `10.21.${shop.id % 250}.${i}`)).status).toBe(202);
      const fourth = await ask(email, `10.21.${shop.id % 250}.9`);
      expect(fourth.status).toBe(429);
      expect(fourth.body.error.code).toBe("too_many_attempts");
      expect(Number(fourth.headers.get("retry-after"))).toBeGreaterThan(0);
    }
    expect(await MailOutbox.count({ where: { toAddress: users.inspector.email } })).toBe(3);
  });

  it("sets a new password from the link, once, and ends every session the old one opened", async () => {
    const { shop, users } = await createShop();
    const oldCookie = await cookieFor(users.machinist);
    expect((await meWith(oldCookie)).status).toBe(200);
    await ask(users.machinist.email, "10.22.0.1");
    await deliverFor(shop.id);
    const [mail] = await waitForMails(users.machinist.email, 1);
    expect(mail.subject).toBe(`New password for Tenthwise at ${shop.name}`);
    const { token } = linkIn(mail, "/reset-password");
    const body = { token, password: "bore gauge zeroed twice" };
    const done = await call(reset, await asUser(null, "POST", "/api/password/reset", body));
    expect(done.status).toBe(200);
    expect((await meWith(oldCookie)).status).toBe(401);
    const again = await call(reset, await asUser(null, "POST", "/api/password/reset", body));
    expect(again.status).toBe(410);
    expect(again.body.error.message).toMatch(/already been used/);
    const headers = { "x-forwarded-for": "10.22.0.2" };
    const creds = (password: string) => ({ email: users.machinist.email, password });
    expect((await call(signIn, await asUser(null, "POST", "/api/session", creds(TEST_PASSWORD), headers))).status).toBe(
      401,
    );
    expect((await call(signIn, await asUser(null, "POST", "/api/session", creds(body.password), headers))).status).toBe(
      200,
    );
  });
});
