// The lead on the shop floor with a tablet: the flag queue at 1024×768 (landscape) and 800×1280
// (portrait) shows the decision column without sideways scrolling, the folded columns as small
// lines under the station, the office navigation on one row, and every button, link and field in
// the header and the main area at least 44 CSS px each way. Demo shop data (invented).
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoEmail, launchBrowser, newTabletPage, screenshot, signInAs } from "../support/browser";

const WAIT = { timeout: 30_000 };
const MIN_TARGET = 44;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function openQueue(width: number, height: number): Promise<Page> {
  const { page } = await newTabletPage(browser, { width, height });
  await signInAs(page, demoEmail("lead"));
  await page.goto("/desk/flags?state=all&sort=age&dir=desc");
  await page.getByTestId("flag-decision").first().waitFor(WAIT);
  return page;
}

/** Interactive elements of the header and the main area smaller than 44 px either way. */
async function smallTargets(page: Page): Promise<string[]> {
  return page.evaluate((min) => {
    const targets = document.querySelectorAll<HTMLElement>(
      "header a, header button, main a, main button, main select, main input, main textarea",
    );
    const small: string[] = [];
    for (const el of targets) {
      const r = el.getBoundingClientRect();
      if (r.width === 0 && r.height === 0) continue; // not shown at this width
      // A checkbox or radio counts by its label, which is what a finger presses.
      const box = el.matches("input[type=checkbox], input[type=radio]") ? el.closest("label") : el;
      const b = box?.getBoundingClientRect() ?? r;
      if (b.width < min || b.height < min) {
        small.push(
          `${el.tagName.toLowerCase()} "${(el.textContent ?? "").trim().slice(0, 30)}" ${b.width}×${b.height}`,
        );
      }
    }
    return small;
  }, MIN_TARGET);
}

describe.each([
  { width: 1024, height: 768, name: "landscape" },
  { width: 800, height: 1280, name: "portrait" },
])("the flag queue on a tablet, $width×$height", ({ width, height, name }) => {
  let page: Page;
  beforeAll(async () => {
    page = await openQueue(width, height);
  });
  afterAll(async () => {
    await page?.context().close();
  });

  it("shows the decision column without sideways scrolling", async () => {
    const table = page.getByTestId("flag-table");
    const fit = await table.evaluate((t) => {
      const frame = t.parentElement!;
      return {
        table: [t.scrollWidth, t.clientWidth],
        frame: [frame.scrollWidth, frame.clientWidth],
        page: [document.documentElement.scrollWidth, document.documentElement.clientWidth],
      };
    });
    expect(fit.table[0]).toBeLessThanOrEqual(fit.table[1]);
    expect(fit.frame[0]).toBeLessThanOrEqual(fit.frame[1]);
    expect(fit.page[0]).toBeLessThanOrEqual(fit.page[1]);
    expect(await page.getByRole("columnheader", { name: "Decision" }).isVisible()).toBe(true);
    const decisions = page.getByTestId("flag-decision");
    expect(await decisions.count()).toBeGreaterThan(0);
    for (const box of await Promise.all((await decisions.all()).map((d) => d.boundingBox()))) {
      expect(box!.x).toBeGreaterThanOrEqual(0);
      expect(box!.x + box!.width).toBeLessThanOrEqual(width);
    }
    await screenshot(page, `flag-queue-${name}`);
  });

  it("folds the hidden columns into the row as small lines", async () => {
    expect(await page.getByRole("columnheader", { name: "Gauge" }).isVisible()).toBe(false);
    const fold = page.getByTestId("flag-fold").first();
    expect(await fold.isVisible()).toBe(true);
    expect(await fold.innerText()).toMatch(/Limits .+ deviation/);
    // Below 1024 px the job folds too; from 1024 px it is a column of its own.
    expect(await page.getByRole("columnheader", { name: "Job" }).isVisible()).toBe(width >= 1024);
    expect(await fold.innerText()).toMatch(width >= 1024 ? /^(?!.*\bJob\b)/s : /Job KF-\d+/);
  });

  it("keeps the office navigation on one row", async () => {
    const tops = await page
      .getByRole("navigation", { name: "Main" })
      .getByRole("link")
      .evaluateAll((links) => links.map((a) => (a as HTMLElement).offsetTop));
    expect(tops.length).toBe(7); // the lead's seven entries
    expect(new Set(tops).size).toBe(1);
    const nav = await page.getByRole("navigation", { name: "Main" }).boundingBox();
    expect(nav!.x + nav!.width).toBeLessThanOrEqual(width);
  });

  it("makes every button, link and field at least 44 px", async () => {
    expect(await smallTargets(page)).toEqual([]);
  });
});

describe("the flag queue on a desktop, 1440×900", () => {
  it("shows every column", async () => {
    const page = await openQueue(1440, 900);
    for (const name of ["Job", "Limits", "Deviation", "Reason", "Gauge", "Who and when", "Decision"]) {
      expect(await page.getByRole("columnheader", { name }).isVisible(), name).toBe(true);
    }
    expect(await page.getByTestId("flag-fold").first().isVisible()).toBe(false);
    expect(await smallTargets(page)).toEqual([]);
    await screenshot(page, "flag-queue-desktop");
    await page.context().close();
  });
});
