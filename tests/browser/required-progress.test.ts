// Required-station progress is one rule (lib/domain/progress.ts, rule of this product): for each
// demo job, the tablet's job list and job screen, the desk board, the job page and the release
// checklist show the same "n of m required stations done", and the tablet's section strip shows
// the job page's figures section by section. Read from the data-done / data-required attributes
// each screen puts beside the figures it prints.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoEmail, launchBrowser, newTabletPage, signInAs } from "../support/browser";

const CODES = ["KF-2611", "KF-2612", "KF-2613"];
type Figures = { done: number; required: number };

let browser: Browser;
let lead: Page;
let bench: Page;
const ids = new Map<string, number>();

beforeAll(async () => {
  browser = await launchBrowser();
  lead = (await newTabletPage(browser, { width: 1440, height: 900 })).page;
  bench = (await newTabletPage(browser)).page;
  await signInAs(lead, demoEmail("lead"));
  await signInAs(bench, demoEmail("machinist"));
  const { jobs } = (await (await lead.request.get("/api/jobs?status=all&pageSize=100")).json()) as {
    jobs: { id: number; code: string }[];
  };
  for (const code of CODES) ids.set(code, jobs.find((j) => j.code === code)!.id);
  // The tablet downloads every listed job in the background; wait until all are on it.
  await bench.goto("/bench");
  for (const code of CODES)
    await bench
      .locator("a[data-job]", { hasText: code })
      .getByTestId("on-tablet")
      .filter({ hasText: "Ready offline" })
      .waitFor({ timeout: 60_000 });
});
afterAll(async () => {
  await browser?.close();
});

async function figures(el: ReturnType<Page["locator"]>): Promise<Figures> {
  await el.waitFor();
  return { done: Number(await el.getAttribute("data-done")), required: Number(await el.getAttribute("data-required")) };
}

async function sections(rows: ReturnType<Page["locator"]>): Promise<Record<string, Figures>> {
  await rows.first().waitFor();
  const out: Record<string, Figures> = {};
  for (const row of await rows.all()) out[(await row.getAttribute("data-section"))!] = await figures(row);
  return out;
}

describe("the same required-station counts on every screen", () => {
  it.each(CODES)("demo job %s", async (code) => {
    const id = ids.get(code)!;

    await lead.goto("/desk");
    const board = await figures(lead.getByRole("row", { name: new RegExp(code) }).getByTestId("required-progress"));
    await lead.goto(`/desk/jobs/${id}`);
    const page = await figures(lead.locator("main").getByTestId("required-progress").first());
    const pageSections = await sections(lead.locator("tr[data-section]"));
    await lead.goto(`/release/${id}`);
    const checklist = await figures(lead.locator("[data-check=readings]").getByTestId("required-progress"));

    await bench.goto("/bench");
    const list = await figures(bench.locator(`a[data-job="${id}"]`).getByTestId("required-progress"));
    await bench.goto(`/bench/job?id=${id}`);
    const screen = await figures(bench.getByTestId("job-screen").getByTestId("required-progress"));
    const strip = await sections(bench.locator("nav[aria-label=Sections] [data-section]"));

    expect(board.required).toBeGreaterThan(0);
    expect({ page, checklist, list, screen }).toEqual({ page: board, checklist: board, list: board, screen: board });
    expect(strip).toEqual(pageSections);
  });
});
