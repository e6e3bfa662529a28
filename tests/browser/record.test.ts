// The customer's path: the e-mailed link opened in a fresh browser (no account, no cookies),
// the record summary read, the PDF downloaded; an expired link explains itself.
import { readFileSync } from "node:fs";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createCustomerToken } from "@/lib/server/customer-link";
import { launchBrowser, newTabletPage, screenshot } from "../support/browser";
import { pdfText } from "../support/pdf-text";
import { ACCEPT_REASON, createRecordJob } from "../support/record-fixtures";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("the customer's record link", () => {
  it("shows the record and downloads the PDF in a fresh browser", async () => {
    const job = await createRecordJob();
    const token = createCustomerToken(job.release!.id);
    const { context, page } = await newTabletPage(browser, { width: 1280, height: 900 });
    expect(await context.cookies()).toEqual([]);
    await page.goto(`/r/${token}`);
    await expect.poll(() => page.getByRole("heading", { name: `Build record ${job.job.code}` }).isVisible()).toBe(true);
    await expect.poll(() => page.getByTestId("release-state").innerText()).toContain(`Signed by ${job.release!.signedName}`);
    expect(await page.getByText(ACCEPT_REASON, { exact: false }).isVisible()).toBe(true);
    expect(await page.locator("[data-verdict=out_of_spec]").count()).toBeGreaterThan(0);
    await screenshot(page, "customer-record");

    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: /Download the full record/ }).click()]);
    expect(download.suggestedFilename()).toBe(`build-record-${job.job.code}.pdf`);
    const bytes = readFileSync((await download.path())!);
    expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
    expect((await pdfText(bytes)).text).toContain(job.release!.hash);

    // The page set no session, and the token opens nothing in the app.
    expect((await context.cookies()).map((c) => c.name)).not.toContain("tw_session");
    const api = await page.evaluate(async (t) => (await fetch(`/api/me?token=${t}`, { headers: { authorization: `Bearer ${t}` } })).status, token);
    expect(api).toBe(401);
    await page.goto("/desk");
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await context.close();
  });

  it("says an expired link has expired and whom to ask; a changed one does not work", async () => {
    const job = await createRecordJob({ photo: false });
    const expired = createCustomerToken(job.release!.id, { ttlSeconds: 60, now: Date.now() - 3600_000 });
    const { context, page } = await newTabletPage(browser);
    await page.goto(`/r/${expired}`);
    await expect.poll(() => page.getByRole("heading", { name: "This link has expired" }).isVisible()).toBe(true);
    expect(await page.getByTestId("ask-shop").innerText()).toContain(job.shop.name);
    await screenshot(page, "customer-link-expired");
    await page.goto(`/r/${expired.slice(0, -3)}abc`);
    await expect.poll(() => page.getByRole("heading", { name: "This link does not work" }).isVisible()).toBe(true);
    await context.close();
  });
});
