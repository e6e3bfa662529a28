// Each demo role signs in, lands on that role's home, and signs out again.
import { readFileSync } from "node:fs";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, newTabletPage, screenshot, signIn } from "../support/browser";

const demo = JSON.parse(readFileSync("scripts/demo-accounts.json", "utf8")) as {
  password: string;
  accounts: { role: string; name: string; email: string }[];
};
const HOME: Record<string, { path: string; heading: RegExp }> = {
  machinist: { path: "/bench", heading: /bench/i },
  lead: { path: "/desk", heading: /jobs/i },
  inspector: { path: "/release", heading: /release/i },
  admin: { path: "/admin", heading: /kestrel flats/i },
};

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("sign-in per role", () => {
  it("sends a signed-out visitor to the sign-in page", async () => {
    const { context, page } = await newTabletPage(browser);
    await page.goto("/desk");
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await screenshot(page, "sign-in-1024x768");
    // From a deeper office page, the sign-in page is told where to lead back to.
    await page.goto("/desk/specs?sort=name");
    const url = new URL(page.url());
    expect(url.pathname).toBe("/sign-in");
    expect(url.searchParams.get("next")).toBe("/desk/specs?sort=name");
    await context.close();
  });

  it("keeps the e-mail and says what went wrong on a bad password", async () => {
    const { context, page } = await newTabletPage(browser);
    await page.goto("/sign-in", { waitUntil: "networkidle" });
    await page.getByLabel("E-mail").fill(demo.accounts[0].email);
    await page.getByLabel("Password").fill("wrong-password");
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect.poll(() => page.getByRole("alert").filter({ hasText: "match" }).count(), { timeout: 15_000 }).toBe(1);
    expect(await page.getByLabel("E-mail").inputValue()).toBe(demo.accounts[0].email);
    await context.close();
  });

  for (const account of demo.accounts) {
    it(`${account.role} lands on their home and can sign out`, async () => {
      const { context, page } = await newTabletPage(browser);
      await signIn(page, account.email, demo.password);
      expect(new URL(page.url()).pathname).toBe(HOME[account.role].path);
      await expect.poll(() => page.getByTestId("whoami").textContent()).toContain(account.name);
      await expect
        .poll(async () => (await page.locator("h1").first().textContent()) ?? "")
        .toMatch(HOME[account.role].heading);
      await screenshot(page, `home-${account.role}-1024x768`);
      await page.getByRole("button", { name: "Sign out" }).click();
      await page.waitForURL((u) => u.pathname === "/sign-in");
      expect(await page.evaluate(() => fetch("/api/me").then((r) => r.status))).toBe(401);
      if (account.role !== "machinist") {
        // The bench is an offline shell served by the service worker; office pages redirect.
        await page.goto(HOME[account.role].path);
        expect(new URL(page.url()).pathname).toBe("/sign-in");
      }
      await context.close();
    });
  }
});
