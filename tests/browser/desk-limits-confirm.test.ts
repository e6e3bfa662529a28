// Before a job's limit change is saved, the lead reads what it will do and confirms; a change that
// opens more than a handful of flags asks again for the number. Demo job KF-2612 (tractor diesel,
// mm; scripts/seed), bore gauge U = 3 µm. Limits by hand from ISO 286-1:2010 Table 1 (80–120 mm:
// IT6 = 22 µm, IT7 = 35 µm; H: EI = 0), conformance zones shrunk by U (ISO 14253-1):
//   H7 104.000–104.035 (zone 104.003–104.032): 104.033 on cylinder 2 marginal, the rest in spec.
//   H6 104.000–104.022 (zone 104.003–104.019): cylinder 2's six out (five were in, one marginal),
//   the three 104.020 readings marginal: 9 verdicts change on 9 required bore stations, 8 flags open.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demo, demoEmail, launchBrowser, newTabletPage, screenshot, signIn } from "../support/browser";

let browser: Browser;
let page: Page;
let jobId = 0;
beforeAll(async () => {
  browser = await launchBrowser();
  page = (await newTabletPage(browser, { width: 1024, height: 768 })).page;
  await signIn(page, demoEmail("lead"), demo.password);
});
afterAll(async () => {
  await browser?.close();
});

/** The job as the server holds it: open flags and the limits' revision. */
async function serverState() {
  const res = await page.request.get(`/api/jobs/${jobId}`);
  const body = (await res.json()) as { job: { specRevision: number }; flags: { open: number } };
  return { open: body.flags.open, revision: body.job.specRevision };
}

async function askToSave(cls: string) {
  await page.goto(`/desk/jobs/${jobId}/limits`);
  const field = page.getByLabel("ISO 286 class");
  await field.waitFor();
  await field.fill(cls);
  await page.getByRole("button", { name: "Save limits" }).click();
  return page.getByTestId("change-consequences");
}

describe("the confirmation before a limit change", () => {
  it("finds the demo diesel job", async () => {
    await page.goto("/desk");
    await page.getByRole("link", { name: /Tractor diesel overhaul/ }).click();
    await page.waitForURL(/\/desk\/jobs\/\d+$/);
    jobId = Number(new URL(page.url()).pathname.split("/").pop());
    expect(jobId).toBeGreaterThan(0);
  });

  it("tightening the bore to H6 says what it will do and saves nothing yet", async () => {
    const before = await serverState();
    const said = await askToSave("H6");
    expect(await said.textContent({ timeout: 30_000 })).toBe(
      "Saving these limits opens 8 flags, changes 9 verdicts, affects 9 required stations.",
    );
    await screenshot(page, "desk-limits-confirm");
    expect(await serverState()).toEqual(before);
    // Keep editing: the panel goes, the class typed stays.
    await page.getByRole("button", { name: "Keep editing" }).click();
    await expect.poll(() => said.count()).toBe(0);
    expect(await page.getByLabel("ISO 286 class").inputValue()).toBe("H6");
  });

  it("asks for the number of flags, refuses another, then saves and the flags open", async () => {
    const before = await serverState();
    await askToSave("H6");
    const ask = page.getByLabel("This opens more than 5 flags. Type 8 to confirm");
    await ask.fill("7");
    await page.getByRole("button", { name: "Confirm and save" }).click();
    await page.getByText("Type 8, the number of flags this change opens, to save it").waitFor();
    expect(await serverState()).toEqual(before);
    await ask.fill("8");
    await page.getByRole("button", { name: "Confirm and save" }).click();
    const saved = page.getByRole("status").filter({ hasText: "Saved as revision" });
    await saved.waitFor({ timeout: 30_000 });
    expect(await saved.textContent()).toContain("8 flags opened");
    expect(await serverState()).toEqual({ open: before.open + 8, revision: before.revision + 1 });
  });

  it("putting H7 back closes them after one confirmation (not a wide change)", async () => {
    const before = await serverState();
    const said = await askToSave("H7");
    expect(await said.textContent({ timeout: 30_000 })).toBe(
      "Saving these limits closes 8 flags, changes 9 verdicts, affects 9 required stations.",
    );
    expect(await page.getByLabel(/Type \d+ to confirm/).count()).toBe(0);
    await page.getByRole("button", { name: "Confirm and save" }).click();
    await page.getByRole("status").filter({ hasText: "Saved as revision" }).waitFor({ timeout: 30_000 });
    expect(await serverState()).toEqual({ open: before.open - 8, revision: before.revision + 1 });
  });
});
