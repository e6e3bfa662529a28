// A person's own password: changing it (the current one required, the policy applied), signing out
// everywhere, and the forced change after an admin set a temporary password.
import { describe, expect, it } from "vitest";
import { POST as changePassword } from "@/app/api/me/password/route";
import { DELETE as everywhere } from "@/app/api/me/sessions/route";
import { GET as me } from "@/app/api/me/route";
import { GET as jobs } from "@/app/api/jobs/route";
import { POST as adminReset } from "@/app/api/users/[userId]/password/route";
import { POST as signIn } from "@/app/api/session/route";
import { WRONG_CURRENT_PASSWORD } from "@/lib/server/accounts/passwords";
import { PASSWORD_CHANGE_FIRST } from "@/lib/server/core/access";
import { createShop, TEST_PASSWORD } from "../support/factories";
import { asUser, call, cookieFor, pageRequest } from "../support/requests";

const NEW = "rod bolt stretch gauge";
const withCookie = (cookie: string, method = "GET", body?: unknown) =>
  pageRequest("/api/x", {
    method,
    headers: body ? { cookie, "content-type": "application/json" } : { cookie },
    body: body ? JSON.stringify(body) : undefined,
  });
const change = (cookie: string, currentPassword: string, newPassword: string) =>
  call(changePassword, withCookie(cookie, "POST", { currentPassword, newPassword }));

describe("changing one's own password", () => {
  it("refuses a wrong current password, naming the field, and keeps the old one", async () => {
    const { users } = await createShop();
    const cookie = await cookieFor(users.lead);
    const res = await change(cookie, "not my password", NEW);
    expect(res.status).toBe(422);
    expect(res.body.error.fields.currentPassword).toEqual([WRONG_CURRENT_PASSWORD]);
    expect((await change(cookie, TEST_PASSWORD, NEW)).status).toBe(200);
  });

  it("refuses a common password and one under 12 characters", async () => {
    const { users } = await createShop();
    const cookie = await cookieFor(users.inspector);
    // "1qaz2wsx3edc" is on the passwords-common list of @zxcvbn-ts/language-common.
    const common = await change(cookie, TEST_PASSWORD, "1qaz2wsx3edc");
    expect(common.status).toBe(422);
    expect(common.body.error.fields.newPassword[0]).toMatch(/common passwords/);
    const short = await change(cookie, TEST_PASSWORD, "eleven-char");
    expect(short.status).toBe(422);
    expect(short.body.error.fields.newPassword[0]).toMatch(/at least 12 characters \(11 so far\)/);
  });

  it("keeps this session and ends the others", async () => {
    const { users } = await createShop();
    const here = await cookieFor(users.admin);
    const elsewhere = await cookieFor(users.admin);
    const res = await change(here, TEST_PASSWORD, NEW);
    expect(res.body).toEqual({ sessionsEnded: 1 });
    expect((await call(me, withCookie(here))).status).toBe(200);
    expect((await call(me, withCookie(elsewhere))).status).toBe(401);
  });
});

describe("signing out everywhere", () => {
  it("ends every session of the person, this one included, and only theirs", async () => {
    const { users } = await createShop();
    const tablet = await cookieFor(users.machinist);
    const phone = await cookieFor(users.machinist);
    const colleague = await cookieFor(users.lead);
    const res = await call(everywhere, withCookie(phone, "DELETE"));
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ sessionsEnded: 2 });
    expect(res.headers.get("set-cookie")).toContain("Max-Age=0");
    expect((await call(me, withCookie(tablet))).status).toBe(401);
    expect((await call(me, withCookie(phone))).status).toBe(401);
    expect((await call(me, withCookie(colleague))).status).toBe(200);
  });
});

describe("a temporary password from an admin", () => {
  it("must be changed at the next sign-in: other work is refused with words until it is", async () => {
    const { users } = await createShop();
    const id = String(users.lead.id);
    const reset = await call(adminReset, await asUser(users.admin, "POST", `/api/users/${id}/password`), {
      userId: id,
    });
    expect(reset.status).toBe(200);
    const temporary: string = reset.body.temporaryPassword;
    const signedIn = await call(
      signIn,
      await asUser(
        null,
        "POST",
        "/api/session",
        { email: users.lead.email, password: temporary },
        {
          "x-forwarded-for": "10.30.0.1",
        },
      ),
    );
    expect(signedIn.status).toBe(200);
    expect(signedIn.body).toMatchObject({ home: "/account", mustChangePassword: true });
    const cookie = (signedIn.headers.get("set-cookie") ?? "").split(";")[0];

    const refused = await call(jobs, withCookie(cookie));
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toBe(PASSWORD_CHANGE_FIRST);
    expect((await call(me, withCookie(cookie))).body.mustChangePassword).toBe(true);

    expect((await change(cookie, temporary, NEW)).status).toBe(200);
    expect((await call(me, withCookie(cookie))).body).toMatchObject({ mustChangePassword: false, home: "/desk" });
    expect((await call(jobs, withCookie(cookie))).status).toBe(200);
  });
});
