// The lead creates a job in Chromium (a new customer, an engine, a spec sheet), is told what to
// fix first, finds the job on the board, moves it to measuring and edits it; the admin reads the
// board without the lead's buttons.
import { randomUUID } from "node:crypto";
import { readFileSync } from "node:fs";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, newTabletPage, screenshot, signIn } from "../support/browser";

const demo = JSON.parse(readFileSync("scripts/demo-accounts.json", "utf8")) as {
  password: string;
  accounts: { role: string; email: string }[];
};
const email = (role: string) => demo.accounts.find((a) => a.role === role)!.email;
const code = `KF-T${randomUUID().slice(0, 4).toUpperCase()}`;

let browser: Browser;
let page: Page;
beforeAll(async () => {
  browser = await launchBrowser();
  page = (await newTabletPage(browser, { width: 1440, height: 900 })).page;
  await signIn(page, email("lead"), demo.password);
});
afterAll(async () => {
  await browser?.close();
});

describe("jobs on the desk", () => {
  it("creates a job; bad entries say what to fix and keep what was typed", async () => {
    await page.getByRole("link", { name: "New job" }).click();
    await page.waitForURL(/\/desk\/jobs\/new$/);
    await page.getByLabel("Job code").fill(code);
    await page.getByLabel("Title").fill("Marine V8 rebuild");
    await page.getByLabel("Spec sheet").selectOption({ label: "Street V8, cast iron block · street · in" });
    await page.getByLabel("A new customer").check();
    await page.getByLabel("Name", { exact: true }).fill("Halvard Quay Boatworks");
    await page.getByLabel("Description").fill("Marine small-block V8");
    await page.getByLabel("Cylinders").fill("7");
    await page.getByLabel("Nominal bore").fill("4.03");
    await page.getByLabel("Nominal stroke").fill("3.48");
    await page.getByRole("button", { name: "Create job" }).click();
    await page.getByText("A V engine has an even number of cylinders").waitFor();
    expect(await page.getByLabel("Title").inputValue()).toBe("Marine V8 rebuild");
    await screenshot(page, "desk-job-new");
    await page.getByLabel("Cylinders").fill("8");
    // The finished bore followed the nominal bore as it was typed; this job is bored 0.030 in over.
    expect(await page.getByLabel("Finished bore").inputValue()).toBe("4.03");
    await page.getByLabel("Finished bore").fill("4.06");
    await page.getByText("0.030 in oversize against the engine's 4.03 in").waitFor();
    await page.getByRole("button", { name: "Create job" }).click();
    await page.waitForURL(/\/desk\/jobs\/\d+$/);
    await page.getByRole("heading", { name: "Marine V8 rebuild" }).waitFor();
    await page.getByText("4.06 in · 0.030 in oversize").waitFor();
    expect(await page.getByText("Halvard Quay Boatworks").count()).toBeGreaterThan(0);
    expect(await page.getByText(/limits on the job · revision 1/).textContent()).toMatch(/^\d+ limits/);
  });

  it("moves it to measuring and edits its due date; the board shows both", async () => {
    await page.getByRole("button", { name: "Start measuring" }).click();
    await page.getByRole("button", { name: "Send to review" }).waitFor();
    await page.getByRole("link", { name: "Edit job" }).click();
    await page.getByLabel("Due date").fill("2027-03-05");
    await page.getByRole("button", { name: "Save changes" }).click();
    await page.waitForURL(/\/desk\/jobs\/\d+$/);
    await page.getByText("2027-03-05").waitFor();
    await page.goto("/desk");
    await page.getByLabel("Search").fill(code);
    // The server searches once typing pauses; the count says when its answer is on screen.
    await page
      .getByRole("status")
      .filter({ hasText: /^1 of \d+ jobs$/ })
      .waitFor();
    const row = page.getByRole("row", { name: new RegExp(code) });
    expect(await row.textContent()).toMatch(/Measuring.*2027-03-05/);
  });

  it("fits a tablet held landscape: nothing wider than the screen", async () => {
    const tablet = (await newTabletPage(browser, { width: 1024, height: 768 })).page;
    await signIn(tablet, email("lead"), demo.password);
    await tablet.getByRole("row", { name: /KF-2611/ }).waitFor();
    const overflow = () => tablet.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(await overflow()).toBeLessThanOrEqual(0);
    await screenshot(tablet, "desk-jobs-board-tablet");
    await tablet.getByRole("link", { name: /Pickup V8 rebuild/ }).click();
    await tablet.getByRole("heading", { name: "Readings" }).waitFor();
    expect(await overflow()).toBeLessThanOrEqual(0);
    await screenshot(tablet, "desk-job-page-tablet");
    await tablet.getByRole("link", { name: /Build plan/ }).click();
    await tablet.getByLabel("Rod length, centre to centre").waitFor();
    expect(await overflow()).toBeLessThanOrEqual(0);
    await screenshot(tablet, "desk-plan-tablet");
  });

  it("the admin reads the board but cannot create jobs", async () => {
    const other = (await newTabletPage(browser, { width: 1440, height: 900 })).page;
    await signIn(other, email("admin"), demo.password);
    await other.goto("/desk");
    await other.getByRole("row", { name: /KF-2611/ }).waitFor();
    expect(await other.getByRole("link", { name: "New job" }).count()).toBe(0);
    await other.goto("/desk/jobs/new");
    expect(new URL(other.url()).pathname).toBe("/admin");
  });
});
