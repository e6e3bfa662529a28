// The shop admin manages people in Chromium: invite by e-mail (no password on screen; the link is
// followed in tests/browser/invitation.test.ts), a reset shows a temporary password once that signs
// in, deactivate and reactivate; the admin's own role cannot be changed here. Invented names.
import { randomUUID } from "node:crypto";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { BASE_URL, demo, launchBrowser, newTabletPage, screenshot, sendJson, signInAs } from "../support/browser";

// Data arrives through TanStack Query after hydration; give the server time on a cold start.
const WAIT = { timeout: 15_000 };
const adminEmail = demo.accounts.find((a) => a.role === "admin")!.email;

const NEW_EMAIL = `wendell-${randomUUID().slice(0, 6)}@kestrelflats.example`;

let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await launchBrowser();
  page = (await newTabletPage(browser, { width: 1440, height: 900 })).page;
  await signInAs(page, adminEmail);
  await page.goto("/admin/users");
});
afterAll(async () => {
  await browser?.close();
});

const row = (email: string) => page.getByTestId(`user-${email}`);

async function canSignIn(email: string, password: string): Promise<boolean> {
  const ctx = await browser.newContext({ baseURL: BASE_URL });
  const res = await sendJson(ctx.request, "POST", "/api/session", { email, password });
  await ctx.close();
  return res.status() === 200;
}

describe("users", () => {
  it("lists the demo people; the admin's own role is locked", async () => {
    await row(adminEmail).waitFor();
    expect(await row(adminEmail).getByRole("combobox").isDisabled()).toBe(true);
    expect(await row(adminEmail).getByRole("button", { name: "Deactivate" }).count()).toBe(0);
  });

  it("invites a machinist by e-mail: no password is shown, and the row offers to send it again", async () => {
    const form = page.getByRole("form", { name: "Invite a person" });
    await form.getByLabel("Name").fill("Wendell Quarry");
    await form.getByLabel("E-mail").fill("not-an-address");
    await form.getByRole("button", { name: "Send invitation" }).click();
    await expect.poll(() => form.textContent(), WAIT).toMatch(/Enter an e-mail like/);
    await form.getByLabel("E-mail").fill(NEW_EMAIL);
    await form.getByRole("button", { name: "Send invitation" }).click();
    await expect.poll(() => page.getByTestId("invitation-sent").textContent(), WAIT).toContain(NEW_EMAIL);
    await row(NEW_EMAIL).waitFor();
    expect(await page.getByTestId("temporary-password").count()).toBe(0);
    expect(await row(NEW_EMAIL).getByRole("button", { name: "Send invitation again" }).count()).toBe(1);
    await screenshot(page, "admin-users-invited");
  });

  it("resets the password: a temporary one is shown once and signs in", async () => {
    const r = row(NEW_EMAIL);
    await r.getByRole("button", { name: "Reset password" }).click();
    await r.getByRole("button", { name: "Yes, issue a new password" }).click();
    const shown = page.getByTestId("temporary-password");
    await shown.waitFor();
    const fresh = (await shown.textContent())!.trim();
    expect(await canSignIn(NEW_EMAIL, fresh)).toBe(true);
    await page.getByRole("button", { name: "Done, I have passed it on" }).click();
  });

  it("changes the role, deactivates and reactivates", async () => {
    const r = row(NEW_EMAIL);
    await r.getByRole("combobox").selectOption("inspector");
    await expect.poll(async () => r.getByRole("combobox").inputValue(), WAIT).toBe("inspector");
    await r.getByRole("button", { name: "Deactivate" }).click();
    await r.getByRole("button", { name: /Yes, deactivate/ }).click();
    await expect.poll(() => r.textContent(), WAIT).toMatch(/Deactivated/);
    expect(await canSignIn(NEW_EMAIL, "any")).toBe(false);
    await screenshot(page, "admin-users");
    await r.getByRole("button", { name: "Reactivate" }).click();
    await expect.poll(() => r.textContent(), WAIT).toMatch(/Active/);
  });
});
