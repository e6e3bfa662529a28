// Starting a shop from the public page, end to end: the sign-in screen's link, the form, the
// confirmation message read from the local mail server, the link's button, and the first-job
// guide waiting on the new shop's empty desk.
import { randomUUID } from "node:crypto";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, newTabletPage, screenshot } from "../support/browser";
import { linkToken, waitForMails } from "../support/mailbox";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("start a shop", () => {
  it("confirms the e-mail from the local mail server and lands on the first-job guide", async () => {
    const tag = randomUUID().slice(0, 8);
    const email = `wren-${tag}@millrace.example`;
    const { context, page } = await newTabletPage(browser);
    await page.goto("/sign-in", { waitUntil: "networkidle" });
    await page.getByRole("link", { name: /Start a shop/ }).click();
    await page.waitForURL("**/start");
    await page.getByLabel("Shop name").fill(`Millrace Engine ${tag}`);
    await page.getByLabel(/Metric/).check();
    await page.getByLabel("Your name").fill("Wren Halloway");
    await page.getByLabel("Your e-mail").fill(email);
    await page.getByLabel("Password").fill("short");
    await page.getByRole("button", { name: "Start the shop" }).click();
    // Refused in words on the field, everything else kept.
    await expect.poll(() => page.getByText(/at least 12 characters/i).count(), { timeout: 10_000 }).toBeGreaterThan(0);
    expect(await page.getByLabel("Your e-mail").inputValue()).toBe(email);
    await page.getByLabel("Password").fill("tailstock-quarry-lantern-8");
    await page.getByRole("button", { name: "Start the shop" }).click();
    await page.getByTestId("check-mail").waitFor({ timeout: 20_000 });
    await screenshot(page, "start-shop-check-mail");

    const [mail] = await waitForMails(email, 1, 30_000);
    expect(mail.subject).toBe(`Confirm your e-mail to open Millrace Engine ${tag} in Tenthwise`);
    await page.goto(`/start/confirm/${linkToken(mail, "/start/confirm")}`, { waitUntil: "networkidle" });
    await page.getByRole("button", { name: "Confirm and open the shop" }).click();
    await page.waitForURL("**/desk", { timeout: 20_000 });

    const guide = page.getByTestId("guide");
    await guide.waitFor({ timeout: 15_000 });
    expect(await guide.locator("li[data-done='false']").count()).toBe(4);
    expect(await guide.getByRole("link", { name: "Open Gauges" }).getAttribute("href")).toBe("/admin/gauges");
    expect(await guide.getByRole("link", { name: "Open Spec sheets" }).getAttribute("href")).toBe("/desk/specs");
    await screenshot(page, "start-shop-guide");

    // The starter sheets are there, marked as typical figures.
    await guide.getByRole("link", { name: "Open Spec sheets" }).click();
    await page.waitForURL("**/desk/specs");
    await expect.poll(() => page.getByText(/Starter · Diesel four/).count(), { timeout: 10_000 }).toBeGreaterThan(0);
    await context.close();
  }, 120_000);
});
