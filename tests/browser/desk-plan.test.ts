// The lead, at a desktop-sized window, opens a demo job from the board, fills its build plan and
// sees the figures the measurement core computes (worked out here by calling lib/domain
// directly), live and again after saving and reloading. Screenshots of the board, the job, the
// plan and a spec sheet go to tests/artifacts/.
import { readFileSync } from "node:fs";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  compressionHeight,
  compressionRatio,
  cubicInToCc,
  deckClearanceFor,
  displacement,
  rodRatio,
  valveLift,
} from "@/lib/domain";
import { launchBrowser, newTabletPage, screenshot, signIn } from "../support/browser";

const demo = JSON.parse(readFileSync("scripts/demo-accounts.json", "utf8")) as {
  password: string;
  accounts: { role: string; email: string }[];
};
const lead = demo.accounts.find((a) => a.role === "lead")!;

// A combination for the demo vintage inline six, KF-2613 (invented test figures, inches and cc).
// Bore and stroke come pre-filled from the job's finished bore and the engine's stroke (3.5925 × 3.75 in,
// six cylinders).
const PLAN = {
  rodLength: 6.125,
  compressionHeight: 1.37,
  deckHeight: 9.38,
  chamberCc: 72,
  dish: 8,
  gasketBore: 3.65,
  gasketThickness: 0.039,
  intakeLobeLift: 0.272,
  exhaustLobeLift: 0.284,
  rockerRatio: 1.5,
  intakeLash: 0.016,
  exhaustLash: 0.018,
};
const BORE = 3.5925;
const STROKE = 3.75;

// What the core says, and the page's reading precision (0.1 in³, 1 cc, 0.01 L and :1, 0.001 rod
// ratio, 0.0001 in deck and heights, 0.001 in lift, 0.01 cc parts).
function expected() {
  const cubicIn = displacement(BORE, STROKE, 6);
  const cc = cubicInToCc(cubicIn);
  const deck = deckClearanceFor({
    deckHeight: PLAN.deckHeight,
    stroke: STROKE,
    rodLength: PLAN.rodLength,
    compressionHeight: PLAN.compressionHeight,
  });
  const cr = compressionRatio({
    lengthUnit: "in",
    bore: BORE,
    stroke: STROKE,
    gasketBore: PLAN.gasketBore,
    gasketThickness: PLAN.gasketThickness,
    deckClearance: deck,
    chamberCc: PLAN.chamberCc,
    pistonCc: PLAN.dish,
  });
  const zero = compressionHeight({
    deckHeight: PLAN.deckHeight,
    stroke: STROKE,
    rodLength: PLAN.rodLength,
    deckClearance: 0,
  });
  const intake = valveLift(PLAN.intakeLobeLift, PLAN.rockerRatio, PLAN.intakeLash);
  const exhaust = valveLift(PLAN.exhaustLobeLift, PLAN.rockerRatio, PLAN.exhaustLash);
  return {
    "plan-cubic-in": `${cubicIn.toFixed(1)} in³`,
    "plan-cc": `${cc.toFixed(0)} cc`,
    "plan-litres": `${(cc / 1000).toFixed(2)} L`,
    "plan-ratio": `${cr.ratio.toFixed(2)} : 1`,
    "plan-swept": `${cr.sweptCc.toFixed(2)} cc`,
    "plan-gasket-cc": `${cr.gasketCc.toFixed(2)} cc`,
    "plan-deck-cc": `${cr.deckCc.toFixed(2)} cc`,
    "plan-clearance": `${cr.clearanceCc.toFixed(2)} cc`,
    "plan-chamber-cc": "72.00 cc",
    "plan-piston-cc": "8.00 cc",
    "plan-rod-ratio-value": rodRatio(PLAN.rodLength, STROKE).toFixed(3),
    "plan-deck-value": `${Math.abs(deck).toFixed(4)} in`,
    "plan-zero-deck": `${zero.compressionHeight.toFixed(4)} in`,
    "plan-intake-gross": `${intake.gross.toFixed(3)} in`,
    "plan-intake-net": `${intake.net.toFixed(3)} in`,
    "plan-exhaust-gross": `${exhaust.gross.toFixed(3)} in`,
    "plan-exhaust-net": `${exhaust.net.toFixed(3)} in`,
    fits: zero.fits,
    below: deck > 0,
  };
}

let browser: Browser;
let page: Page;
beforeAll(async () => {
  browser = await launchBrowser();
  page = (await newTabletPage(browser, { width: 1440, height: 900 })).page;
  await signIn(page, lead.email, demo.password);
});
afterAll(async () => {
  await browser?.close();
});

async function checkFigures() {
  const want = expected();
  for (const [id, text] of Object.entries(want)) {
    if (typeof text !== "string") continue;
    await expect.poll(() => page.getByTestId(id).textContent(), { timeout: 10_000 }).toBe(text);
  }
  expect(await page.getByTestId("plan-fits").textContent()).toContain(
    want.fits ? "Parts fit the block" : "Parts do not fit",
  );
  expect(await page.getByTestId("plan-deck").textContent()).toContain(want.below ? "below the deck" : "above the deck");
}

describe("the lead's build plan", () => {
  it("finds the demo job on the board and opens it", async () => {
    expect(new URL(page.url()).pathname).toBe("/desk");
    const row = page.getByRole("row", { name: /KF-2613/ });
    await row.waitFor();
    expect(await page.getByRole("row", { name: /KF-2611/ }).textContent()).toContain("Pickup V8 rebuild");
    await screenshot(page, "desk-jobs-board");
    await page.getByRole("link", { name: /Vintage six freshen-up/ }).click();
    await page.waitForURL(/\/desk\/jobs\/\d+$/);
    await page.getByRole("heading", { name: "Vintage six freshen-up" }).waitFor();
    await page.getByRole("heading", { name: "Readings" }).waitFor();
    await screenshot(page, "desk-job-page");
  });

  it("fills the plan and sees the core's figures live", async () => {
    await page.getByRole("link", { name: /Build plan/ }).click();
    await page.waitForURL(/\/plan$/);
    await page.getByLabel("Rod length, centre to centre").waitFor();
    expect(await page.getByLabel("Bore (finished)").inputValue()).toBe(String(BORE));
    expect(await page.getByLabel("Stroke").inputValue()).toBe(String(STROKE));
    expect(await page.getByTestId("plan-compression").textContent()).toMatch(/enter/i);
    await page.getByLabel("Rod length, centre to centre").fill(String(PLAN.rodLength));
    await page.getByLabel("Piston compression height").fill(String(PLAN.compressionHeight));
    await page.getByLabel("Block deck height").fill(String(PLAN.deckHeight));
    await page.getByLabel("Chamber volume").fill(String(PLAN.chamberCc));
    await page.getByLabel("Piston top").selectOption("dish");
    await page.getByLabel("Dish volume").fill(String(PLAN.dish));
    await page.getByLabel("Gasket bore").fill(String(PLAN.gasketBore));
    await page.getByLabel("Gasket thickness, compressed").fill(String(PLAN.gasketThickness));
    await page.getByLabel("Intake lobe lift").fill(String(PLAN.intakeLobeLift));
    await page.getByLabel("Exhaust lobe lift").fill(String(PLAN.exhaustLobeLift));
    await page.getByLabel("Rocker ratio").fill(String(PLAN.rockerRatio));
    await page.getByLabel("Intake lash").fill(String(PLAN.intakeLash));
    await page.getByLabel("Exhaust lash").fill(String(PLAN.exhaustLash));
    await checkFigures();
    expect(await page.getByRole("note").filter({ hasText: "do not replace" }).count()).toBe(1);
    await screenshot(page, "desk-plan");
  });

  it("says what to fix for a bad figure and keeps what was typed", async () => {
    await page.getByLabel("Gasket bore").fill("3,65");
    await expect.poll(() => page.getByText("Enter the gasket bore as a number").count()).toBe(1);
    expect(await page.getByLabel("Gasket bore").inputValue()).toBe("3,65");
    await page.getByLabel("Gasket bore").fill(String(PLAN.gasketBore));
    await expect.poll(() => page.getByText("Enter the gasket bore as a number").count()).toBe(0);
  });

  it("saves the plan on the job; after a reload the same figures show", async () => {
    await page.getByRole("button", { name: "Save plan" }).click();
    await page.getByRole("status").filter({ hasText: "Plan saved on the job." }).waitFor();
    await page.reload();
    await page.getByLabel("Rod length, centre to centre").waitFor();
    expect(await page.getByLabel("Rod length, centre to centre").inputValue()).toBe(String(PLAN.rodLength));
    await checkFigures();
  });

  it("shows a spec sheet with its limits", async () => {
    await page.goto("/desk/specs");
    await page.getByRole("link", { name: "Vintage inline six, mild street" }).click();
    await page.getByRole("heading", { name: "Vintage inline six, mild street" }).waitFor();
    await page.getByText("Accepts each job's finished bore −0.0001 / +0.0005 in").first().waitFor();
    await page.screenshot({ path: "tests/artifacts/desk-spec-sheet.png" }); // the top of a long sheet
  });
});
