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

/** A fresh 1024×768 tablet page in one theme, signed in as the role (or nobody). */
async function tablet(role: string | null, theme: (typeof THEMES)[number]) {
  const { context, page } = await newTabletPage(browser, { width: 1024, height: 768 });
  // The theme is what the toggle remembers on the device, read by the page before it paints.
  await context.addInitScript((t) => localStorage.setItem("tw-theme", t), theme);
  if (role) await signInAs(page, demoEmail(role));
  return { context, page };
}

/** Audits each path in both themes; returns every finding with its theme and screen. */
async function audit(role: string | null, paths: (page: Page) => Promise<string[]>): Promise<string[]> {
  const all: string[] = [];
  for (const theme of THEMES) {
    const { context, page } = await tablet(role, theme);
    for (const path of await paths(page)) {
      await settle(page, path);
      expect(await page.evaluate(() => document.documentElement.classList.contains("dim"))).toBe(theme === "dim");
      for (const f of await findings(page)) all.push(`${theme} ${path}: ${f}`);
    }
    await context.close();
  }
  return all;
}

const get = async <T>(page: Page, url: string) => (await (await page.context().request.get(url)).json()) as T;

async function demoJobAndFlag(page: Page) {
  // The release list is the one job list every office role may read.
  const jobs = (await get<{ jobs: { id: number; code: string }[] }>(page, "/api/release")).jobs;
  const job = jobs.find((j) => j.code === "KF-2611")!.id;
  const flag = (await get<{ items: { id: number }[] }>(page, `/api/flags?state=all&job=${job}`)).items[0].id;
  return { job, flag };
}

// Two themes of up to fourteen screens each: longer than a browser test's usual three minutes.
const LONG = 900_000;

describe("accessibility audit (axe-core, WCAG 2.2 AA), bright and dim", () => {
  it("sign-in and the customer's record link", { timeout: LONG }, async () => {
    const record = await createRecordJob();
    const token = createCustomerToken(record.release!.id);
    // An unknown link shows the page's refusal; the account form itself is audited in the admin's run below.
    const signedOut = ["/sign-in", "/start", "/start/confirm/not-a-real-token", `/r/${token}`];
    const accounts = ["/forgot-password", "/set-password/not-a-link-we-sent"];
    expect(await audit(null, async () => [...signedOut, ...accounts])).toEqual([]);
  });

  it("the lead's screens", { timeout: LONG }, async () => {
    const paths = async (page: Page) => {
      const { job, flag } = await demoJobAndFlag(page);
      const spec = (await get<{ templates: { id: number }[] }>(page, "/api/specs")).templates[0].id;
      return [
        "/desk",
        "/desk/jobs/new",
        `/desk/jobs/${job}`,
        `/desk/jobs/${job}/edit`,
        `/desk/jobs/${job}/limits`,
        `/desk/jobs/${job}/plan`,
        `/desk/jobs/${job}/maps`,
        `/desk/jobs/${job}/bearings`,
        "/desk/bearing-grades",
        "/desk/specs",
        `/desk/specs/${spec}`,
        "/desk/specs/new",
        "/desk/specs/import",
        "/desk/flags",
        `/desk/flags/${flag}`,
        "/audit",
      ];
    };
    expect(await audit("lead", paths)).toEqual([]);
  });

  it("the inspector's screens", { timeout: LONG }, async () => {
    const paths = async (page: Page) => {
      const { job, flag } = await demoJobAndFlag(page);
      return ["/release", `/release/${job}`, "/desk/flags", `/desk/flags/${flag}`, "/admin/gauges", "/audit"];
    };
    expect(await audit("inspector", paths)).toEqual([]);
  });

  it("the admin's screens", { timeout: LONG }, async () => {
    const paths = async () => [
      "/admin",
      "/admin/users",
      "/admin/gauges",
      "/admin/mail",
      "/desk",
      "/desk/specs",
      "/audit",
      "/account",
    ];
    expect(await audit("admin", paths)).toEqual([]);
  });

  it("the machinist's bench: job list, job screen and gauge studies", { timeout: LONG }, async () => {
    const paths = async (page: Page) => {
      const jobs = (await get<{ jobs: { id: number }[] }>(page, "/api/bench/jobs")).jobs;
      return ["/bench", `/bench/job?id=${jobs[0].id}`, "/bench/studies"];
    };
    expect(await audit("machinist", paths)).toEqual([]);
  });
});
