// The lead edits a demo job's own bore limit in Chromium and sees the verdicts change on the job
// page, then puts it back. Demo job KF-2612 (tractor diesel, mm; scripts/seed): bores of
// cylinders 1, 3, 4 read 104.012–104.020 mm, cylinder 2 104.024–104.033 mm, bore gauge U = 3 µm.
// Limits by hand from ISO 286-1:2010 Table 1 (80–120 mm: IT6 = 22 µm, IT7 = 35 µm; H: EI = 0):
//   H7 = 104.000–104.035, conformance zone with U (ISO 14253-1) 104.003–104.032:
//     23 in spec, 1 marginal (104.033), 0 out.
//   H6 = 104.000–104.022, zone 104.003–104.019: cylinder 2's six are out; the three 104.020 are
//     marginal; the other 15 in spec.
import { readFileSync } from "node:fs";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, newTabletPage, screenshot, signIn } from "../support/browser";

const demo = JSON.parse(readFileSync("scripts/demo-accounts.json", "utf8")) as {
  password: string;
  accounts: { role: string; email: string }[];
};
const lead = demo.accounts.find((a) => a.role === "lead")!;

let browser: Browser;
let page: Page;
let jobUrl = "";
beforeAll(async () => {
  browser = await launchBrowser();
  page = (await newTabletPage(browser, { width: 1440, height: 900 })).page;
  await signIn(page, lead.email, demo.password);
});
afterAll(async () => {
  await browser?.close();
});

async function boreCounts() {
  await page.goto(jobUrl);
  const row = page.getByRole("row", { name: /Cylinder bores/ });
  await row.waitFor();
  const cell = (v: string) => row.locator(`td[data-verdict="${v}"]`).textContent();
  return [await cell("in_spec"), await cell("marginal"), await cell("out_of_spec")].map(Number);
}

async function setBoreClass(cls: string) {
  await page.goto(`${jobUrl}/limits`);
  const field = page.getByLabel("ISO 286 class");
  await field.waitFor();
  await field.fill(cls);
  await page.getByRole("button", { name: "Save limits" }).click();
  // The consequences come first (tests/browser/desk-limits-confirm.test.ts checks them); a wide
  // change asks for the number of flags it opens.
  const said = await page.getByTestId("change-consequences").textContent({ timeout: 30_000 });
  const opens = /opens (\d+) flags?/.exec(said ?? "")?.[1];
  const ask = page.getByLabel(/Type \d+ to confirm/);
  if (await ask.count()) await ask.fill(opens ?? "");
  await page.getByRole("button", { name: "Confirm and save" }).click();
  const status = page.getByRole("status").filter({ hasText: "Saved as revision" });
  await status.waitFor({ timeout: 30_000 });
  return status.textContent();
}

describe("editing a job's limits", () => {
  it("opens the demo diesel job from the board", async () => {
    await page.getByRole("link", { name: /Tractor diesel overhaul/ }).click();
    await page.waitForURL(/\/desk\/jobs\/\d+$/);
    jobUrl = new URL(page.url()).pathname;
    expect(await boreCounts()).toEqual([23, 1, 0]);
  });

  it("tightens the bore to H6: verdicts flip and flags open", async () => {
    const text = await setBoreClass("H6");
    // 24 bore readings now carry new limits; 5 new out-of-spec flags on cylinder 2 and 3 marginal
    // ones on the 104.020 readings; the standing marginal flag on 104.033 becomes out of spec.
    expect(text).toContain("24 readings re-judged");
    expect(text).toContain("8 flags opened");
    expect(text).toContain("1 flag updated");
    await page.getByText("Accepts", { exact: false }).first().waitFor();
    await screenshot(page, "desk-limits");
    expect(await boreCounts()).toEqual([15, 3, 6]);
    await screenshot(page, "desk-job-after-limits");
  });

  it("puts H7 back: the same flags close", async () => {
    const text = await setBoreClass("H7");
    expect(text).toContain("8 flags closed");
    expect(await boreCounts()).toEqual([23, 1, 0]);
  });

  it("says what to fix for a class the core does not know, and keeps the entry", async () => {
    await page.goto(`${jobUrl}/limits`);
    const field = page.getByLabel("ISO 286 class");
    await field.fill("H12");
    await page.getByRole("button", { name: "Save limits" }).click();
    await expect.poll(() => page.getByText(/grade 12; supported/).count()).toBe(1);
    expect(await field.inputValue()).toBe("H12");
  });
});
