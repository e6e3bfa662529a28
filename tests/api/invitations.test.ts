// Invitations by e-mail: the admin's invite queues a message whose one-time link lets the person
// choose their own password; the link works once, not after it expires, and not after a newer one.
import { describe, expect, it } from "vitest";
import { POST as invite } from "@/app/api/users/route";
import { POST as resend } from "@/app/api/users/[userId]/invitation/route";
import { POST as setPassword } from "@/app/api/password/set/route";
import { POST as signIn } from "@/app/api/session/route";
import { tokenProblemWords } from "@/lib/server/tokens/service";
import { LinkToken, MailOutbox } from "@/models";
import { createShop } from "../support/factories";
import { linkIn, waitForMails } from "../support/mailbox";
import { deliverFor } from "../support/record-fixtures";
import { asUser, call } from "../support/requests";

const CHOSEN = "copper gasket torque order";

async function invited(role = "machinist") {
  const s = await createShop();
  const email = `new-${s.shop.id}-${Date.now()}@test.example`;
  const res = await call(
    invite,
    await asUser(s.users.admin, "POST", "/api/users", { name: "Ruth Okafor", email, role }),
  );
  return { ...s, res, email };
}

async function linkFor(shopId: number, email: string, n = 1) {
  await deliverFor(shopId);
  const mails = await waitForMails(email, n);
  expect(mails).toHaveLength(n);
  return { mail: mails[n - 1], ...linkIn(mails[n - 1], "/set-password") };
}

const choose = async (token: string, password = CHOSEN) =>
  call(setPassword, await asUser(null, "POST", "/api/password/set", { token, password }));

const signInAs = async (email: string, password: string) =>
  call(signIn, await asUser(null, "POST", "/api/session", { email, password }, { "x-forwarded-for": "10.9.0.1" }));

describe("invitations by e-mail", () => {
  it("shows no password to the admin, e-mails a link, and the link sets the person's own password once", async () => {
    const { shop, res, email } = await invited();
    expect(res.status).toBe(201);
    expect(res.body.invitationSentTo).toBe(email);
    expect(JSON.stringify(res.body)).not.toMatch(/temporaryPassword/);
    const queued = await MailOutbox.findOne({ where: { shopId: shop.id, toAddress: email } });
    expect(queued?.kind).toBe("invitation");
    expect(JSON.stringify(queued?.payload)).not.toMatch(/set-password/); // the link is made when sent

    const { mail, token } = await linkFor(shop.id, email);
    expect(mail.subject).toBe(`Your Tenthwise account at ${shop.name}`);
    expect(mail.text).toMatch(/works once, until \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC/);
    // Before the link is used nobody can sign in to the new account.
    expect((await signInAs(email, CHOSEN)).status).toBe(401);

    const first = await choose(token);
    expect(first.status).toBe(200);
    expect(first.body).toEqual({ email });
    const signedIn = await signInAs(email, CHOSEN);
    expect(signedIn.status).toBe(200);
    expect(signedIn.body.mustChangePassword).toBe(false);

    const again = await choose(token, "another long password here");
    expect(again.status).toBe(410);
    expect(again.body.error.message).toBe(tokenProblemWords("set_password", "used"));
  });

  it("refuses an expired link, and a link replaced by a newer invitation, with words saying what to do", async () => {
    const { shop, users, res, email } = await invited("inspector");
    const first = await linkFor(shop.id, email);
    await LinkToken.update({ expiresAt: new Date(Date.now() - 60_000) }, { where: { userId: res.body.user.id } });
    const expired = await choose(first.token);
    expect(expired.status).toBe(410);
    expect(expired.body.error.message).toBe(tokenProblemWords("set_password", "expired"));
    expect(expired.body.error.message).toMatch(/admin to send the invitation again/);

    const resent = await call(resend, await asUser(users.admin, "POST", `/api/users/${res.body.user.id}/invitation`), {
      userId: String(res.body.user.id),
    });
    expect(resent.status).toBe(200);
    const second = await linkFor(shop.id, email, 2);
    expect(second.token).not.toBe(first.token);
    expect((await choose(second.token)).status).toBe(200);
  });

  it("keeps the link working when the chosen password is refused, naming the field", async () => {
    const { shop, email } = await invited();
    const { token } = await linkFor(shop.id, email);
    const short = await choose(token, "short");
    expect(short.status).toBe(422);
    expect(short.body.error.fields.password[0]).toMatch(/at least 12 characters \(5 so far\)/);
    // On the common list shipped with @zxcvbn-ts/language-common (passwords-common).
    const common = await choose(token, "qwerty123456");
    expect(common.status).toBe(422);
    expect(common.body.error.fields.password[0]).toMatch(/list of common passwords/);
    expect((await choose(token)).status).toBe(200);
  });

  it("lets only an admin resend, only to someone who has not signed in, and never across shops", async () => {
    const { users, res } = await invited();
    const other = await createShop();
    const id = String(res.body.user.id);
    const path = `/api/users/${id}/invitation`;
    expect((await call(resend, await asUser(users.lead, "POST", path), { userId: id })).status).toBe(403);
    expect((await call(resend, await asUser(other.users.admin, "POST", path), { userId: id })).status).toBe(404);
    const signedIn = String(users.machinist.id);
    const { User } = await import("@/models");
    await User.update({ lastSignInAt: new Date() }, { where: { id: users.machinist.id } });
    const refused = await call(resend, await asUser(users.admin, "POST", `/api/users/${signedIn}/invitation`), {
      userId: signedIn,
    });
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/already signed in/);
  });
});
