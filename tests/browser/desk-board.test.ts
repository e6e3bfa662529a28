// The jobs board a page at a time, on a tablet held landscape (1024×768): page controls large
// enough to tap and reached by the keyboard, the total, and the address keeping page, filter and
// sort, so a reload shows the same page.
import { randomUUID } from "node:crypto";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demo, demoEmail, launchBrowser, newTabletPage, screenshot, sendJson, signIn } from "../support/browser";

const tag = randomUUID().slice(0, 4).toUpperCase();
const JOBS = 27;
const codeOf = (n: number) => `PG${tag}-${n}`;

let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await launchBrowser();
  page = (await newTabletPage(browser)).page;
  await signIn(page, demoEmail("lead"), demo.password);
  const api = page.context().request;
  const { customers } = (await (await api.get("/api/customers")).json()) as { customers: { id: number }[] };
  const { templates } = (await (await api.get("/api/specs")).json()) as { templates: { id: number }[] };
  for (let n = 1; n <= JOBS; n++) {
    const res = await sendJson(api, "POST", "/api/jobs", {
      code: codeOf(n),
      title: "Paging check",
      customer: { mode: "existing", id: customers[0].id },
      engine: {
        description: "Inline six",
        cylinders: 6,
        layout: "inline",
        mains: 7,
        valvesPerCylinder: 2,
        ringsPerPiston: 3,
        boltsPerRod: 2,
        nominalBore: 3.75,
        nominalStroke: 3.5,
        blockMaterial: "greyCastIron",
      },
      unitSystem: "in",
      templateId: templates[0].id,
      // Far off, so the demo jobs stay on the first page of the default view for other tests.
      dueDate: `2099-01-${String(n).padStart(2, "0")}`,
      status: "intake",
      notes: "",
    });
    if (res.status() !== 201) throw new Error(`Creating ${codeOf(n)} answered ${res.status()}: ${await res.text()}`);
  }
}, 120_000);
afterAll(async () => {
  await browser?.close();
});

const codesShown = async () => await page.getByTestId("jobs-table").locator("tbody tr .font-mono").allTextContents();

describe("the jobs board a page at a time", () => {
  it("shows the total and 25 jobs, and the next page from the keyboard", async () => {
    await page.goto(`/desk?q=PG${tag}&sort=code`);
    await page
      .getByTestId("board-count")
      .filter({ hasText: `${JOBS} of` })
      .waitFor();
    expect(await page.getByTestId("page-info").textContent()).toBe(`1–25 of ${JOBS} · page 1 of 2`);
    expect(await codesShown()).toHaveLength(25);
    const next = page.getByRole("button", { name: "Next" });
    const box = (await next.boundingBox())!;
    expect(Math.min(box.width, box.height)).toBeGreaterThanOrEqual(44);
    await next.focus();
    await page.keyboard.press("Enter");
    await page.waitForURL(/page=2/);
    await page.getByTestId("page-info").filter({ hasText: "26–27" }).waitFor();
    expect(await codesShown()).toEqual([codeOf(26), codeOf(27)]);
    await screenshot(page, "desk-board-page-2-tablet");
  });

  it("keeps page, search and sort in the address: a reload shows the same page", async () => {
    await page.reload();
    await page.getByTestId("page-info").filter({ hasText: "26–27" }).waitFor();
    expect(await codesShown()).toEqual([codeOf(26), codeOf(27)]);
    expect(await page.getByLabel("Search").inputValue()).toBe(`PG${tag}`);
  });

  it("sorts by a column header the other way and starts again at page 1", async () => {
    await page.getByRole("button", { name: /^Job/ }).click();
    await page.waitForURL((u) => u.searchParams.get("dir") === "desc" && !u.searchParams.has("page"));
    await page.getByTestId("page-info").filter({ hasText: "1–25" }).waitFor();
    expect((await codesShown())[0]).toBe(codeOf(27));
    await page.getByRole("group", { name: "Status" }).getByRole("button", { name: "Released" }).click();
    await page.getByText("No job matches these filters.").waitFor();
    expect(new URL(page.url()).searchParams.get("status")).toBe("released");
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, "desk-board-no-match-tablet");
  });
});
