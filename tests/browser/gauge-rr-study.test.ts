// An R&R study on the tablet, end to end against the demo shop, in the smallest balanced design
// (2 people × 5 parts × 2 trials): the machinist picks the demo's 2–3 in outside micrometer, names a
// second person, sets 5 parts and 2 trials, types each figure into the cell the grid asks for, sees
// the ANOVA table, %GRR and ndc with what saving changes, and saves. The kept study holds every
// figure in its cell, and its sums of squares agree with simple-statistics (a reference library).
import AxeBuilder from "@axe-core/playwright";
import type { Page } from "playwright-core";
import { mean, sumNthPowerDeviations } from "simple-statistics";
import { afterAll, describe, expect, it } from "vitest";
import { demo, launchBrowser, newTabletPage, screenshot, signIn } from "../support/browser";

const ROSA = "rosa@kestrelflats.example";
const SECOND = "Dev Okonkwo";
let close: (() => Promise<void>) | undefined;
afterAll(async () => close?.());

// Invented main-journal diameters (in), read to the micrometer's 0.0001 in: FIGURES[trial][person][part].
const FIGURES = [
  [
    [2.4492, 2.4496, 2.4489, 2.4499, 2.4494],
    [2.4493, 2.4496, 2.449, 2.45, 2.4494],
  ],
  [
    [2.4491, 2.4497, 2.4489, 2.4498, 2.4494],
    [2.4493, 2.4497, 2.449, 2.4499, 2.4495],
  ],
];
const TOTAL = 2 * 5 * 2;

type Measurement = { appraiser: number; part: number; trial: number; value: number };
type Study = {
  kind: string;
  appraisers: string[];
  measurements: Measurement[];
  tolerance: number | null;
  grr: { anova: { source: string; df: number; ss: number }[]; ndc: number; pctStudyVariation: number };
};

async function axeFindings(page: Page): Promise<string[]> {
  const tags = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa"];
  const result = await new AxeBuilder({ page }).withTags(tags).analyze();
  return result.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .flatMap((v) => v.nodes.map((n) => `${v.id}: ${n.target.join(" ")} — ${n.failureSummary}`));
}

/** Screenshots at both tablet sizes, the portrait one and back. */
async function bothSizes(page: Page, name: string) {
  await screenshot(page, `${name}-1024x768`);
  await page.setViewportSize({ width: 800, height: 1280 });
  await screenshot(page, `${name}-800x1280`);
  await page.setViewportSize({ width: 1024, height: 768 });
}

/** The figure for the cell the entry's label names: "Trial 1 · Rosa Calloway · part 3". */
async function figureAsked(page: Page, people: string[]): Promise<string> {
  const label = (await page.locator("label[for=tw-entry]").textContent()) ?? "";
  const m = /^Trial (\d) · (.+) · part (\d+)$/.exec(label.trim());
  if (!m) throw new Error(`Unexpected entry label: ${label}`);
  const person = people.indexOf(m[2]);
  expect(person, `${m[2]} is one of the study's people`).toBeGreaterThanOrEqual(0);
  return FIGURES[Number(m[1]) - 1][person][Number(m[3]) - 1].toFixed(4);
}

describe("an R&R study on the tablet", () => {
  it("takes 2 people × 5 parts × 2 trials, shows the ANOVA, %GRR and ndc, and saves every figure", async () => {
    const browser = await launchBrowser();
    close = () => browser.close();
    const { page } = await newTabletPage(browser);
    await signIn(page, ROSA, demo.password);
    const me = demo.accounts.find((a) => a.email === ROSA)!.name;

    await page.getByRole("link", { name: "Gauge studies" }).click();
    await page.getByRole("button", { name: /R&R study/ }).click();
    await page.getByRole("button", { name: /Outside micrometer 2–3 in/ }).click();
    await page.getByLabel("Person 2").fill(SECOND);
    await page.getByRole("group", { name: "Parts" }).getByRole("button", { name: "5", exact: true }).click();
    await page.getByRole("group", { name: "Trials" }).getByRole("button", { name: "2", exact: true }).click();
    await page.getByLabel(/Tolerance T of the characteristic/).fill("0.001");
    await bothSizes(page, "gauge-rr-setup");
    expect(await axeFindings(page)).toEqual([]);
    await page.getByRole("button", { name: "Start measuring" }).click();

    const entry = page.getByTestId("entry");
    await entry.waitFor();
    for (let i = 0; i < TOTAL; i++) {
      await page.keyboard.type(await figureAsked(page, [me, SECOND]));
      await page.keyboard.press("Enter");
      await expect.poll(() => page.getByTestId("study-count").textContent()).toBe(`${i + 1} of ${TOTAL}`);
      if (i === 9) {
        await bothSizes(page, "gauge-rr-entry-half");
        expect(await axeFindings(page)).toEqual([]);
      }
    }
    await page.getByRole("button", { name: "Work out the result" }).click();
    const anova = page.getByTestId("grr-anova");
    await anova.waitFor({ timeout: 30_000 });
    expect(await anova.textContent()).toMatch(/Distinct categories \(ndc\)/);
    expect(await page.getByTestId("study-consequences").textContent()).toMatch(/^Saving this study /);
    await bothSizes(page, "gauge-rr-result");
    expect(await axeFindings(page)).toEqual([]);
    const shownNdc = await anova.locator("dt", { hasText: "Distinct categories (ndc)" }).locator("+ dd").textContent();

    await page.getByRole("button", { name: "Save the study" }).click();
    await page.getByTestId("study-saved").waitFor({ timeout: 30_000 });
    await bothSizes(page, "gauge-rr-saved");

    const gaugeId = await page.evaluate(async () => {
      const { instruments } = await (await fetch("/api/bench/gauges")).json();
      return instruments.find((g: { label: string }) => g.label === "Outside micrometer 2–3 in").id as number;
    });
    const studies: Study[] = await page.evaluate(
      async (id) => (await (await fetch(`/api/gauges/${id}/studies`)).json()).studies,
      gaugeId,
    );
    const study = studies[0];
    expect(study).toMatchObject({ kind: "grr", appraisers: [me, SECOND], tolerance: 0.001 });
    expect(study.measurements).toHaveLength(TOTAL);
    for (const m of study.measurements)
      expect(m.value, `trial ${m.trial}, person ${m.appraiser}, part ${m.part}`).toBe(
        FIGURES[m.trial - 1][m.appraiser - 1][m.part - 1],
      );
    expect(String(study.grr.ndc)).toBe(shownNdc?.trim());

    // Sums of squares by definition (simple-statistics): total about the grand mean; parts from the
    // part means, each over 2 people × 2 trials; people from their means, each over 5 parts × 2 trials.
    const all = FIGURES.flat(2);
    const partMeans = [0, 1, 2, 3, 4].map((p) => mean(FIGURES.flatMap((t) => t.map((person) => person[p]))));
    const personMeans = [0, 1].map((a) => mean(FIGURES.flatMap((t) => t[a])));
    const row = (source: string) => study.grr.anova.find((r) => r.source === source)!;
    expect(row("total").ss).toBeCloseTo(sumNthPowerDeviations(all, 2), 12);
    expect(row("part").ss).toBeCloseTo(4 * sumNthPowerDeviations(partMeans, 2), 12);
    expect(row("appraiser").ss).toBeCloseTo(10 * sumNthPowerDeviations(personMeans, 2), 12);
    expect(row("total").df).toBe(TOTAL - 1);
  }, 300_000);
});
