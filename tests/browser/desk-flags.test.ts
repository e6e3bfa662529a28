// The lead at a desktop works demo flags through each decision in Chromium: the machinist (rosa)
// first sends out-of-spec readings for demo job KF-2611 through POST /api/sync; the lead disposes
// one flag of each kind; "measure again" then reaches the tablet through the job pack; a new
// in-spec reading closes that flag and its decision history stays. Figures are invented.
import { randomUUID } from "node:crypto";
import { type APIRequestContext, type Browser, type Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiContext, demo, demoEmail, launchBrowser, newTabletPage, screenshot, signInAs } from "../support/browser";

// Data arrives through TanStack Query after hydration; give the server time on a cold start.
const WAIT = { timeout: 15_000 };
const email = demoEmail;

let browser: Browser;
let page: Page;
let rosa: APIRequestContext;
let jobId: number;
let gauges: { serial: string; id: number }[];
// Demo gauges (scripts/seed/demo-gauges.ts): the dial bore gauge for bores, the 2–3 in micrometer for journals.
const gaugeFor = (stationId: string) =>
  gauges.find((g) => g.serial === (stationId.startsWith("bore") ? "KF-DB-07" : "KF-M23-01"))!.id;
const apis: APIRequestContext[] = [];

async function apiAs(role: string) {
  const ctx = await apiContext();
  apis.push(ctx);
  expect((await ctx.post("/api/session", { data: { email: email(role), password: demo.password } })).status()).toBe(
    200,
  );
  return ctx;
}

async function send(stationId: string, value: number, supersedes?: string): Promise<string> {
  const id = randomUUID();
  const res = await rosa.post("/api/sync", {
    data: {
      deviceId: "desk-flags-test",
      readings: [
        {
          id,
          jobId,
          stationId,
          value,
          unit: "in",
          instrumentId: gaugeFor(stationId),
          takenAt: new Date().toISOString(),
          ...(supersedes ? { supersedes } : {}),
        },
      ],
    },
  });
  expect(res.status(), await res.text()).toBe(200);
  return id;
}

// Demo spec KF-2611: bore 4.0299–4.0304 in, main journal 2.4485–2.4495 in (scripts/seed/demo-specs.ts).
const STATIONS = { measure: "bore/5/top/A", machine: "bore/6/mid/B", accept: "main/3/front/A" };

beforeAll(async () => {
  rosa = await apiAs("machinist");
  const jobs = (await (await rosa.get("/api/bench/jobs")).json()).jobs as { id: number; code: string }[];
  jobId = jobs.find((j) => j.code === "KF-2611")!.id;
  const pack = await (await rosa.get(`/api/bench/jobs/${jobId}`)).json();
  gauges = pack.instruments;
  await send(STATIONS.measure, 4.0312);
  await send(STATIONS.machine, 4.0296);
  await send(STATIONS.accept, 2.4478);
  browser = await launchBrowser();
  page = (await newTabletPage(browser, { width: 1440, height: 900 })).page;
  await signInAs(page, email("lead"));
});
afterAll(async () => {
  for (const a of apis) await a.dispose();
  await browser?.close();
});

async function openFlag(stationWords: RegExp) {
  await page.goto(`/desk/flags?job=${jobId}&state=active&sort=station&dir=asc`);
  const link = page.getByTestId("open-flag").filter({ hasText: stationWords }).first();
  await link.waitFor();
  await link.click();
  await page.waitForURL(/\/desk\/flags\/\d+$/);
  await page.getByRole("heading", { level: 1 }).waitFor();
  return Number(new URL(page.url()).pathname.split("/").pop());
}

const decisions = () => page.getByTestId("decisions");

describe("the lead's flag queue", () => {
  it("lists the job's flags with words, verdict and reason; sorting and filters live in the URL", async () => {
    await page.goto(`/desk/flags?job=${jobId}`);
    const table = page.getByTestId("flag-table");
    await expect.poll(() => table.textContent(), WAIT).toMatch(/Cylinder 5 · top of bore · axis A \(thrust\)/);
    const text = (await table.textContent()) ?? "";
    expect(text).toMatch(/Out of spec/);
    expect(text).toMatch(/Main journal 3 · front end · axis A/);
    await page.getByRole("button", { name: /Station/ }).click();
    await page.waitForURL(/sort=station/);
    await screenshot(page, "desk-flags-queue");
  });

  it("measure again: recorded with the note; the tablet's pack marks the station", async () => {
    const id = await openFlag(/Cylinder 5 · top of bore/);
    await screenshot(page, "desk-flag-open");
    await page.getByLabel("Measure again").check();
    await page.getByLabel("Note for the machinist (optional)").fill("Re-zero on the setting ring, then read again");
    await page.getByRole("button", { name: "Record decision" }).click();
    await expect.poll(() => decisions().textContent(), WAIT).toMatch(/Measure again.*Re-zero on the setting ring/s);
    const pack = await (await rosa.get(`/api/bench/jobs/${jobId}`)).json();
    expect(pack.flags.find((f: { id: number }) => f.id === id)).toMatchObject({
      disposition: "measure_again",
      revisit: true,
      stations: [STATIONS.measure],
    });
  });

  it("machine again: the lead picks an offered operation", async () => {
    await openFlag(/Cylinder 6 · middle of bore/);
    await page.getByLabel("Machine again").check();
    await page.getByRole("button", { name: "hone", exact: true }).click();
    expect(await page.getByLabel("Operation", { exact: true }).inputValue()).toBe("hone");
    await page.getByRole("button", { name: "Record decision" }).click();
    await expect.poll(() => decisions().textContent(), WAIT).toMatch(/Machine again: hone/);
  });

  it("accept: refused without a reason (and nothing typed is lost), recorded with one; the verdict stays", async () => {
    await openFlag(/Main journal 3 · front end/);
    await page.getByLabel("Accept as is").check();
    await page.getByRole("button", { name: "Record decision" }).click();
    await expect.poll(() => page.getByText(/Write why this value is accepted/).count(), WAIT).toBeGreaterThan(0);
    await page
      .getByLabel(/Why is it accepted as it is/)
      .fill("Crank to be ground undersize by the customer's own shop; recorded as received");
    await page.getByRole("button", { name: "Record decision" }).click();
    await expect.poll(() => decisions().textContent(), WAIT).toMatch(/Accepted as is.*Reason: Crank to be ground/s);
    expect(await page.locator('[data-verdict="out_of_spec"]').count()).toBeGreaterThan(0);
    await screenshot(page, "desk-flag-accepted");
  });

  it("a new in-spec reading closes the measure-again flag; its decision stays on record", async () => {
    const id = await openFlag(/Cylinder 5 · top of bore/);
    const pack = await (await rosa.get(`/api/bench/jobs/${jobId}`)).json();
    // The machinist's correction of the flagged reading (the tablet sends `supersedes`).
    const flagged = pack.flags.find((f: { id: number }) => f.id === id).readingId;
    await send(STATIONS.measure, 4.0301, flagged);
    await page.goto(`/desk/flags/${id}`);
    await expect
      .poll(
        () =>
          page
            .getByRole("note")
            .filter({ hasText: /Closed/ })
            .count(),
        WAIT,
      )
      .toBeGreaterThan(0);
    expect(await decisions().textContent()).toMatch(/Measure again/);
    expect(await page.getByRole("button", { name: "Record decision" }).count()).toBe(0);
    await screenshot(page, "desk-flag-closed");
  });
});
