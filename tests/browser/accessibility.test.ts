// Every screen, as each role meets it, checked with axe-core against the WCAG 2.0, 2.1 and 2.2
// A and AA rules, in the bright and the dim theme: nothing serious or critical may remain.
// Screens are opened on the seeded demo shop (invented data) plus one released job of our own
// for the customer's record link.
import AxeBuilder from "@axe-core/playwright";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createCustomerToken } from "@/lib/server/release/customer-link";
import { demoEmail, launchBrowser, newTabletPage, signInAs } from "../support/browser";
import { createRecordJob } from "../support/record-fixtures";

const WCAG_AA = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa"];
const THEMES = ["bright", "dim"] as const;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** The serious and critical findings on the page as it stands, one line each. */
async function findings(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page }).withTags(WCAG_AA).analyze();
  return result.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .flatMap((v) => v.nodes.map((n) => `${v.id} (${v.impact}): ${n.target.join(" ")} — ${n.failureSummary}`));
}

async function settle(page: Page, path: string) {
  await page.goto(path, { waitUntil: "networkidle", timeout: 90_000 });
  // Screens fill in through TanStack Query after hydration; audit what the user reads, not a spinner.
  await page.waitForFunction(() => !document.querySelector("[aria-busy=true]"), null, { timeout: 15_000 });
}

/** Audits each path in both themes on one signed-in page; returns every finding with its screen. */
async function audit(page: Page, paths: string[]): Promise<string[]> {
  const all: string[] = [];
  for (const theme of THEMES) {
    await page.evaluate((t) => localStorage.setItem("tw-theme", t), theme);
    for (const path of paths) {
      await settle(page, path);
      expect(await page.evaluate(() => document.documentElement.classList.contains("dim"))).toBe(theme === "dim");
      for (const f of await findings(page)) all.push(`${theme} ${path}: ${f}`);
    }
  }
  return all;
}

async function signedIn(role: string) {
  const { context, page } = await newTabletPage(browser, { width: 1024, height: 768 });
  await signInAs(page, demoEmail(role));
  await page.goto("/sign-in"); // any page of ours, so localStorage belongs to the app's origin
  return { context, page };
}

const get = async <T>(page: Page, url: string) => (await (await page.context().request.get(url)).json()) as T;

async function demoJobAndFlag(page: Page) {
  // The release list is the one job list every office role may read.
  const jobs = (await get<{ jobs: { id: number; code: string }[] }>(page, "/api/release")).jobs;
  const job = jobs.find((j) => j.code === "KF-2611")!.id;
  const flag = (await get<{ items: { id: number }[] }>(page, `/api/flags?state=all&job=${job}`)).items[0].id;
  return { job, flag };
}

describe("accessibility audit (axe-core, WCAG 2.2 AA), bright and dim", () => {
  it("sign-in and the customer's record link", async () => {
    const { context, page } = await newTabletPage(browser, { width: 1024, height: 768 });
    const record = await createRecordJob();
    const token = createCustomerToken(record.release!.id);
    await page.goto("/sign-in");
    expect(await audit(page, ["/sign-in", `/r/${token}`])).toEqual([]);
    await context.close();
  });

  it("the lead's screens", async () => {
    const { context, page } = await signedIn("lead");
    const { job, flag } = await demoJobAndFlag(page);
    const spec = (await get<{ templates: { id: number }[] }>(page, "/api/specs")).templates[0].id;
    const paths = [
      "/desk",
      "/desk/jobs/new",
      `/desk/jobs/${job}`,
      `/desk/jobs/${job}/edit`,
      `/desk/jobs/${job}/limits`,
      `/desk/jobs/${job}/plan`,
      `/desk/jobs/${job}/maps`,
      "/desk/specs",
      `/desk/specs/${spec}`,
      "/desk/specs/new",
      "/desk/specs/import",
      "/desk/flags",
      `/desk/flags/${flag}`,
      "/audit",
    ];
    expect(await audit(page, paths)).toEqual([]);
    await context.close();
  });

  it("the inspector's screens", async () => {
    const { context, page } = await signedIn("inspector");
    const { job } = await demoJobAndFlag(page);
    expect(await audit(page, ["/release", `/release/${job}`, "/desk/flags", "/admin/gauges", "/audit"])).toEqual([]);
    await context.close();
  });

  it("the admin's screens", async () => {
    const { context, page } = await signedIn("admin");
    expect(await audit(page, ["/admin", "/admin/users", "/admin/gauges", "/admin/mail", "/desk/specs"])).toEqual([]);
    await context.close();
  });

  it("the machinist's bench: job list and job screen", async () => {
    const { context, page } = await signedIn("machinist");
    const jobs = (await get<{ jobs: { id: number }[] }>(page, "/api/bench/jobs")).jobs;
    expect(await audit(page, ["/bench", `/bench/job?id=${jobs[0].id}`])).toEqual([]);
    await context.close();
  });
});
