// A repeatability run on the tablet, end to end against the demo shop: the machinist picks the demo
// dial bore gauge, takes its setting ring from the gauge's record, lets the gauge send 25 dial
// readings as keystrokes (a spread worse than the gauge's certificate), sees the result with Cg
// and Cgk and what saving changes, saves it, and the job's marginal bore reading (4.0302 in, just
// inside its upper limit) changes verdict because the gauge's uncertainty now counts the study.
import AxeBuilder from "@axe-core/playwright";
import type { Page } from "playwright-core";
import { afterAll, describe, expect, it } from "vitest";
import { demo, launchBrowser, newTabletPage, screenshot, signIn } from "../support/browser";

const ROSA = "rosa@kestrelflats.example";
let close: (() => Promise<void>) | undefined;
afterAll(async () => close?.());

// Invented dial readings (in, plus means smaller on this gauge): a spread of several tenths
// around the ring, worse than the certificate's U, so the guard band widens.
const DIAL = [
  "+0.0003",
  "-0.0002",
  "+0.0001",
  "-0.0004",
  "+0.0002",
  "0",
  "-0.0003",
  "+0.0004",
  "-0.0001",
  "+0.0002",
  "-0.0002",
  "+0.0003",
  "0",
  "-0.0004",
  "+0.0001",
  "+0.0002",
  "-0.0003",
  "+0.0004",
  "-0.0001",
  "0",
  "+0.0003",
  "-0.0002",
  "+0.0001",
  "-0.0003",
  "+0.0002",
];

type Reading = { id: string; stationId: string; value: number | null; verdict: string | null; instrumentId?: number };
/** Serious and critical WCAG 2.2 AA findings on screen (a run's screens need a run, so they are checked here). */
async function axeFindings(page: Page): Promise<string[]> {
  const tags = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa"];
  const result = await new AxeBuilder({ page }).withTags(tags).analyze();
  return result.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .flatMap((v) => v.nodes.map((n) => `${v.id}: ${n.target.join(" ")} — ${n.failureSummary}`));
}

const jobReadings = (page: Page, jobId: string): Promise<Reading[]> =>
  page.evaluate(async (id) => (await (await fetch(`/api/bench/jobs/${id}`)).json()).readings, jobId);

describe("a gauge study on the tablet", () => {
  it("runs 25 readings by gauge keystrokes, shows Cg and Cgk, saves, and a marginal verdict changes", async () => {
    const browser = await launchBrowser();
    close = () => browser.close();
    const { page } = await newTabletPage(browser);
    await signIn(page, ROSA, demo.password);
    const card = page.locator("a[data-job]", { hasText: "KF-2611" });
    const jobId = (await card.getAttribute("data-job"))!;
    const gauges = await page.evaluate(async () => (await (await fetch("/api/bench/gauges")).json()).instruments);
    const dial = gauges.find((g: { serial: string }) => g.serial === "KF-DB-07");
    const near = (await jobReadings(page, jobId)).filter((r) => r.value === 4.0302 && r.instrumentId === dial.id);
    expect(near.length).toBeGreaterThan(0);
    const before = new Map(near.map((r) => [r.id, r.verdict]));

    await page.getByRole("link", { name: "Gauge studies" }).click();
    await page.getByRole("button", { name: /Dial bore gauge 2–6 in/ }).click();
    await page.getByRole("button", { name: "Use this reference" }).click();
    const entry = page.getByTestId("entry");
    await entry.waitFor();
    for (const [i, d] of DIAL.entries()) {
      await page.keyboard.type(d);
      await page.keyboard.press("Enter");
      await expect.poll(() => page.getByTestId("study-count").textContent()).toMatch(new RegExp(`^${i + 1} of 25`));
    }
    await screenshot(page, "gauge-study-entry-1024x768");
    expect(await axeFindings(page)).toEqual([]);
    await page.getByRole("button", { name: "Work out the result" }).click();
    await page.getByTestId("study-characteristics").waitFor({ timeout: 30_000 });
    const words = await page.getByTestId("study-consequences").textContent();
    expect(words).toMatch(/changes \d+ verdicts?/);
    expect(await page.getByTestId("study-characteristics").textContent()).toMatch(/Bore/i);
    await screenshot(page, "gauge-study-result-1024x768");
    expect(await axeFindings(page)).toEqual([]);
    await page.setViewportSize({ width: 800, height: 1280 });
    await screenshot(page, "gauge-study-result-800x1280");
    await page.setViewportSize({ width: 1024, height: 768 });

    await page.getByRole("button", { name: "Save the study" }).click();
    await page.getByTestId("study-saved").waitFor({ timeout: 30_000 });
    await screenshot(page, "gauge-study-saved-1024x768");
    const after = await jobReadings(page, jobId);
    const changed = after.filter((r) => before.has(r.id) && before.get(r.id) !== r.verdict);
    expect(changed.length).toBeGreaterThan(0);
    expect(changed.every((r) => r.verdict === "marginal")).toBe(true);
  }, 240_000);
});
