// A gauge's setting master, set on the admin's gauge page and used on the tablet: the admin gives the
// demo's 3–4 in outside micrometer a gauge block (a figure outside its range is refused in words and
// what was typed stays), and the machinist's repeatability run on it offers that block's size and U as
// its reference. Invented figures.
import AxeBuilder from "@axe-core/playwright";
import { afterAll, describe, expect, it } from "vitest";
import { type Browser, type Page } from "playwright-core";
import { demo, demoEmail, launchBrowser, newTabletPage, screenshot, signIn, signInAs } from "../support/browser";

const WAIT = { timeout: 15_000 };
const MIC = "Outside micrometer 3–4 in";
let browser: Browser | undefined;

/** Serious and critical WCAG 2.2 AA findings on screen. */
async function axeFindings(page: Page): Promise<string[]> {
  const tags = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa"];
  const result = await new AxeBuilder({ page }).withTags(tags).analyze();
  return result.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .flatMap((v) => v.nodes.map((n) => `${v.id}: ${n.target.join(" ")} — ${n.failureSummary}`));
}
afterAll(async () => browser?.close());

describe("a gauge's setting master", () => {
  it("is set by the admin on the gauge page and offered by the tablet's repeatability run", async () => {
    browser = await launchBrowser();
    const { page: admin } = await newTabletPage(browser);
    await signInAs(admin, demoEmail("admin"));
    await admin.goto("/admin/gauges");
    const gaugeId = await admin.evaluate(async (label) => {
      const { instruments } = await (await fetch("/api/instruments")).json();
      return instruments.find((g: { label: string }) => g.label === label).id as number;
    }, MIC);
    await admin.goto(`/admin/gauges/${gaugeId}`);
    const form = admin.getByRole("form", { name: "Setting master" });
    await form.waitFor(WAIT);
    expect(await admin.getByTestId("master-line").textContent()).toMatch(/None on file/);

    await form.getByLabel("Name as marked").fill("Gauge block 3.5 in, KF-GB-35");
    await form.getByLabel("Size (in)").fill("4.5");
    await form.getByLabel(/Certificate's U/).fill("0.00003");
    await form.getByRole("button", { name: "Put this master on file" }).click();
    await expect.poll(() => form.textContent(), WAIT).toMatch(/outside this gauge's range, 3–4 in/);
    expect(await form.getByLabel("Name as marked").inputValue()).toBe("Gauge block 3.5 in, KF-GB-35");
    await screenshot(admin, "gauge-master-refused-1024x768");
    expect(await axeFindings(admin)).toEqual([]);

    await form.getByLabel("Size (in)").fill("3.5");
    await form.getByRole("button", { name: "Put this master on file" }).click();
    await expect.poll(() => admin.getByTestId("master-line").textContent(), WAIT).toMatch(/size 3.5 in/);
    expect(await form.getByRole("status").textContent()).toMatch(/Saved/);
    await screenshot(admin, "gauge-master-saved-1024x768");
    expect(await axeFindings(admin)).toEqual([]);
    await admin.setViewportSize({ width: 800, height: 1280 });
    await screenshot(admin, "gauge-master-saved-800x1280");

    const { page: tablet } = await newTabletPage(browser);
    await signIn(tablet, demoEmail("machinist"), demo.password);
    await tablet.getByRole("link", { name: "Gauge studies" }).click();
    await tablet.getByRole("button", { name: /Repeatability run/ }).click();
    await tablet.getByRole("button", { name: new RegExp(MIC) }).click();
    const reference = tablet.getByRole("form", { name: "Reference" });
    await reference.waitFor(WAIT);
    expect(await reference.textContent()).toMatch(/setting master on file for this gauge is Gauge block 3.5 in/);
    expect(await reference.getByLabel("Reference size (in)").inputValue()).toBe("3.5");
    expect(await reference.getByLabel("Certificate's U (in)").inputValue()).toBe("0.00003");
    await screenshot(tablet, "gauge-master-tablet-reference-1024x768");
  }, 180_000);
});
