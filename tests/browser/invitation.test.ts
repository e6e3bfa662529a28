// Accepting an invitation in Chromium: the admin invites by e-mail, the message is read from the
// local fake SMTP server (MAIL_DIR), the person opens its link, chooses a password with the length
// rule counting as they type, signs in with it, and finds the link used up. Then a temporary
// password from an admin leads to the account screen until it is changed. Invented names.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, newTabletPage, screenshot, signIn } from "../support/browser";
import { createShop, TEST_PASSWORD, type TestShop } from "../support/factories";
import { linkIn, waitForMails } from "../support/mailbox";
import { deliverFor } from "../support/record-fixtures";

const WAIT = { timeout: 15_000 };
const CHOSEN = "main caps torqued in order";

let browser: Browser;
let s: TestShop;

beforeAll(async () => {
  browser = await launchBrowser();
  s = await createShop();
});
afterAll(async () => {
  await browser?.close();
});

describe("an invitation by e-mail", () => {
  const email = `odile-${Date.now()}@test.example`;

  it("is sent from the users screen and its link lets the person choose a password, once", async () => {
    const admin = await newTabletPage(browser, { width: 1280, height: 900 });
    await signIn(admin.page, s.users.admin.email, TEST_PASSWORD);
    await admin.page.goto("/admin/users");
    const form = admin.page.getByRole("form", { name: "Invite a person" });
    await form.getByLabel("Name").fill("Odile Marchetti");
    await form.getByLabel("E-mail").fill(email);
    await form.getByRole("button", { name: "Send invitation" }).click();
    await expect.poll(() => admin.page.getByTestId("invitation-sent").textContent(), WAIT).toContain(email);
    await admin.context.close();

    // The app sends it at once; this only covers a slow start of its background send.
    const mails = await waitForMails(email, 1, 5_000).catch(async () => {
      await deliverFor(s.shop.id);
      return waitForMails(email, 1);
    });
    expect(mails).toHaveLength(1);
    const { url } = linkIn(mails[0], "/set-password");
    const path = new URL(url).pathname;

    const { context, page } = await newTabletPage(browser);
    await page.goto(path, { waitUntil: "networkidle" });
    await expect.poll(() => page.getByRole("heading", { name: "Choose your password" }).isVisible()).toBe(true);
    const field = page.getByLabel("New password");
    await field.fill("too short");
    await expect.poll(() => page.getByText("(9 so far)").isVisible()).toBe(true);
    await page.getByRole("button", { name: "Save my password" }).click();
    await expect
      .poll(() =>
        page
          .getByText(/Use at least 12 characters/)
          .first()
          .isVisible(),
      )
      .toBe(true);
    await field.fill("qwerty123456"); // on the @zxcvbn-ts/language-common list: the server's words show
    await page.getByRole("button", { name: "Save my password" }).click();
    await expect.poll(() => page.getByText(/list of common passwords/).isVisible(), WAIT).toBe(true);
    await field.fill(CHOSEN);
    await screenshot(page, "set-password");
    await page.getByRole("button", { name: "Save my password" }).click();
    await page.getByTestId("password-set").waitFor(WAIT);

    await signIn(page, email, CHOSEN);
    expect(new URL(page.url()).pathname).toBe("/bench");

    await page.goto(path);
    await expect.poll(() => page.getByTestId("link-refused").textContent(), WAIT).toMatch(/already been used/);
    await context.close();
  });
});

describe("a temporary password from an admin", () => {
  it("leads to the account screen until the person chooses their own", async () => {
    const admin = await newTabletPage(browser, { width: 1280, height: 900 });
    await signIn(admin.page, s.users.admin.email, TEST_PASSWORD);
    await admin.page.goto("/admin/users");
    const row = admin.page.getByTestId(`user-${s.users.lead.email}`);
    await row.getByRole("button", { name: "Reset password" }).click();
    await row.getByRole("button", { name: "Yes, issue a new password" }).click();
    const temporary = (await admin.page.getByTestId("temporary-password").textContent(WAIT))!.trim();
    await admin.context.close();

    const { context, page } = await newTabletPage(browser);
    await signIn(page, s.users.lead.email, temporary);
    expect(new URL(page.url()).pathname).toBe("/account");
    await page.goto("/desk");
    await page.waitForURL((u) => u.pathname === "/account");
    expect(await page.getByTestId("password-change-owed").isVisible()).toBe(true);
    await screenshot(page, "account-change-owed");
    await page.getByLabel("Current password").fill(temporary);
    await page.getByLabel("New password").fill("valve lash set cold engine");
    await page.getByRole("button", { name: "Change password" }).click();
    await page.waitForURL((u) => u.pathname === "/desk", WAIT);
    await context.close();
  });
});
