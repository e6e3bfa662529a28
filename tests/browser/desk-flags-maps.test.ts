// Bore, journal and deck maps of demo job KF-2611 in Chromium, for the lead and the inspector,
// on screen and as printed. The machinist (rosa) first sends invented readings through POST /api/sync.
import { randomUUID } from "node:crypto";
import { type APIRequestContext, type Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiContext, BASE_URL, demo, demoEmail, launchBrowser, screenshot, signInAs } from "../support/browser";

const email = demoEmail;

// Demo spec KF-2611: bore 4.0299–4.0304, main 2.4485–2.4495, rod 2.0985–2.0995, deck 9.022–9.028 (in).
const FIGURES: Record<string, number> = {
  "bore/3/top/A": 4.0304,
  "bore/3/mid/A": 4.0301,
  "bore/3/bottom/A": 4.03,
  "bore/3/top/B": 4.0302,
  "bore/3/mid/B": 4.0301,
  "bore/3/bottom/B": 4.03,
  "bore/4/top/A": 4.0308,
  "bore/4/mid/A": 4.0303,
  "bore/4/bottom/A": 4.03,
  "bore/4/top/B": 4.0301,
  "bore/4/mid/B": 4.0301,
  "bore/4/bottom/B": 4.03,
  "main/2/front/A": 2.4491,
  "main/2/front/B": 2.4489,
  "main/2/rear/A": 2.449,
  "main/2/rear/B": 2.4486,
  "rod/2/front/A": 2.0992,
  "rod/2/front/B": 2.0988,
  "rod/2/rear/A": 2.099,
  "rod/2/rear/B": 2.0991,
  "deck/left/front": 9.025,
  "deck/left/rear": 9.027,
  "deck/right/front": 9.024,
  "deck/right/rear": 9.029,
};

let browser: Browser;
let jobId: number;
const apis: APIRequestContext[] = [];

beforeAll(async () => {
  const rosa = await apiContext();
  apis.push(rosa);
  expect(
    (await rosa.post("/api/session", { data: { email: email("machinist"), password: demo.password } })).status(),
  ).toBe(200);
  const jobs = (await (await rosa.get("/api/bench/jobs")).json()).jobs as { id: number; code: string }[];
  jobId = jobs.find((j) => j.code === "KF-2611")!.id;
  const pack = await (await rosa.get(`/api/bench/jobs/${jobId}`)).json();
  // Demo gauges (scripts/seed/demo-gauges.ts): each station gets one of a kind that measures it.
  const serial = (id: string) =>
    id.startsWith("bore") ? "KF-DB-07" : id.startsWith("deck") ? "KF-DH-08" : "KF-M23-01";
  const gauge = (id: string) => pack.instruments.find((g: { serial: string }) => g.serial === serial(id)).id;
  const readings = Object.entries(FIGURES).map(([stationId, value]) => ({
    id: randomUUID(),
    jobId,
    stationId,
    value,
    unit: "in",
    instrumentId: gauge(stationId),
    takenAt: new Date().toISOString(),
  }));
  const res = await rosa.post("/api/sync", { data: { deviceId: "maps-test", readings } });
  expect(res.status(), await res.text()).toBe(200);
  browser = await launchBrowser();
});
afterAll(async () => {
  for (const a of apis) await a.dispose();
  await browser?.close();
});

async function open(role: string) {
  const ctx = await browser.newContext({ baseURL: BASE_URL, viewport: { width: 1440, height: 1000 } });
  const page = await ctx.newPage();
  await signInAs(page, email(role));
  await page.goto(`/desk/jobs/${jobId}/maps`);
  await page.getByTestId("map-Cylinder 4").waitFor();
  return { ctx, page };
}

describe("maps", () => {
  it("the lead sees every bore, journal and the deck, with limits, taper and out-of-round", async () => {
    const { ctx, page } = await open("lead");
    expect(await page.locator("[data-testid^='map-Cylinder']").count()).toBe(8);
    expect(await page.locator("[data-testid^='map-Main journal']").count()).toBe(5);
    expect(await page.locator("[data-testid^='map-Rod journal']").count()).toBe(4);
    const c4 = page.getByTestId("map-Cylinder 4");
    expect(await c4.locator("svg.recharts-surface").count()).toBe(1);
    const text = (await c4.textContent()) ?? "";
    expect(text).toMatch(/4\.0299 – 4\.0304 in/);
    // Taper on axis A: 4.0308 − 4.0300 = 0.0008 in, over the 0.0005 in maximum (geometry as in engine service manuals, common practice).
    expect(text).toMatch(/Taper0\.0008 in\(max 0\.0005\)Out of spec/);
    expect(await page.getByTestId("map-deck").textContent()).toMatch(/Right bank, rear9\.0290Out of spec/);
    await screenshot(page, "desk-maps");
    await page.emulateMedia({ media: "print" });
    await screenshot(page, "desk-maps-print");
    await ctx.close();
  });

  it("the inspector may read them too", async () => {
    const { ctx, page } = await open("inspector");
    expect(await page.getByTestId("map-Cylinder 3").textContent()).toMatch(/Taper0\.0004 in/);
    await ctx.close();
  });
});
