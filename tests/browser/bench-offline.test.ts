// The bench with no network, end to end in Chromium: the machinist opens a job, the network goes,
// a section is logged by keypad and by gauge keystrokes (one value out of spec, confirmed), the
// page is reloaded and the browser restarted offline (everything still there), the network comes
// back, the badge reaches zero, and the lead sees the new flag through the API.
import { readFileSync } from "node:fs";
import type { BrowserContext, Page } from "playwright-core";
import { afterAll, describe, expect, it } from "vitest";
import { launchBrowser, launchProfile, screenshot, signIn } from "../support/browser";

const demo = JSON.parse(readFileSync("scripts/demo-accounts.json", "utf8")) as { password: string };
const ROSA = "rosa@kestrelflats.example";
const LEAD = "dev@kestrelflats.example";
// Demo V8 (KF-2611) deck height: 9.025 ± 0.003 in (scripts/seed/demo-specs.ts, invented demo data).
const DECK = ["deck/left/front", "deck/left/rear", "deck/right/front", "deck/right/rear"];

let context: BrowserContext | undefined;
afterAll(async () => {
  await context?.close().catch(() => undefined);
});

const pending = (page: Page) => page.getByTestId("sync-badge").getAttribute("data-pending");
const station = (page: Page) => page.getByTestId("where").getAttribute("data-station");

async function tapValue(page: Page, text: string) {
  for (const ch of text)
    await page.getByRole("button", { name: ch === "." ? "Decimal point" : ch, exact: true }).click();
  await page.getByRole("button", { name: "Save", exact: true }).click();
}

async function gaugeSends(page: Page, text: string) {
  await page.keyboard.type(text);
  await page.keyboard.press("Enter");
}

async function openJob(page: Page, jobId: string) {
  await page.goto(`/bench/job?id=${jobId}`);
  await page.getByTestId("job-screen").waitFor();
}

describe("bench offline", () => {
  it("logs a section with no network, survives a reload and a restart, then syncs and flags", async () => {
    const profile = await launchProfile();
    context = profile.context;
    const page = context.pages()[0] ?? (await context.newPage());
    await signIn(page, ROSA, demo.password);
    expect(new URL(page.url()).pathname).toBe("/bench");
    const card = page.locator("a[data-job]", { hasText: "KF-2611" });
    await card.getByTestId("on-tablet").filter({ hasText: "Ready offline" }).waitFor({ timeout: 30_000 });
    const jobId = (await card.getAttribute("data-job"))!;
    await page.waitForFunction(() => navigator.serviceWorker?.controller !== null, undefined, { timeout: 60_000 });
    await screenshot(page, "bench-list-1024x768");

    await card.click();
    await page.getByTestId("job-screen").waitFor();
    await context.setOffline(true);
    await page.locator("[data-section=deck]").click();
    await expect.poll(() => station(page)).toBe(DECK[0]);

    await tapValue(page, "9.025"); // keypad
    await expect.poll(() => page.getByTestId("last-entry").getAttribute("data-verdict")).toBe("in_spec");
    await expect.poll(() => station(page)).toBe(DECK[1]);
    await gaugeSends(page, "9.0255"); // a gauge typing
    await expect.poll(() => station(page)).toBe(DECK[2]);
    await gaugeSends(page, "9.0312"); // out of spec: the bench asks to confirm
    await expect.poll(() => page.getByTestId("last-entry").getAttribute("data-verdict")).toBe("out_of_spec");
    await expect.poll(() => page.getByText("Measure this station again to confirm").count()).toBe(1);
    expect(await station(page)).toBe(DECK[2]);
    await screenshot(page, "bench-confirm-1024x768");
    await gaugeSends(page, "9.0311");
    await expect.poll(() => station(page)).toBe(DECK[3]);
    await tapValue(page, "9.024");
    await expect.poll(() => page.locator("[data-section=deck]").textContent()).toContain("4 of 4");
    await expect.poll(() => pending(page)).toBe("5");
    await screenshot(page, "bench-job-1024x768");
    await page.setViewportSize({ width: 800, height: 1280 });
    await screenshot(page, "bench-job-800x1280");
    await page.setViewportSize({ width: 390, height: 844 });
    await screenshot(page, "bench-job-390x844");
    await page.setViewportSize({ width: 1280, height: 800 });
    await screenshot(page, "bench-job-1280x800");
    await page.setViewportSize({ width: 1024, height: 768 });

    // Reload with no network: the worker serves the shell, IndexedDB still holds every reading.
    await page.reload();
    await page.getByTestId("job-screen").waitFor();
    await expect.poll(() => page.locator("[data-section=deck]").textContent()).toContain("4 of 4");
    await expect.poll(() => pending(page)).toBe("5");

    // Close the browser and start it again on the same profile, still offline.
    await context.close();
    context = (await launchProfile(profile.userDataDir)).context;
    await context.setOffline(true);
    const again = context.pages()[0] ?? (await context.newPage());
    await openJob(again, jobId);
    await expect.poll(() => again.locator("[data-section=deck]").textContent()).toContain("4 of 4");
    await expect.poll(() => pending(again)).toBe("5");
    expect(await again.getByTestId("sync-badge").textContent()).toContain("Offline");

    // Network back: the engine sends on the `online` event and the badge reaches zero.
    await context.setOffline(false);
    await expect.poll(() => pending(again), { timeout: 60_000 }).toBe("0");
    await expect.poll(() => again.getByTestId("sync-badge").textContent(), { timeout: 30_000 }).toContain("All sent");
    await screenshot(again, "bench-synced-1024x768");

    // The lead sees the flag the server raised for the confirmed out-of-spec deck height.
    const browser = await launchBrowser();
    try {
      const lead = await (await browser.newContext({ baseURL: process.env.TW_BASE_URL })).newPage();
      await signIn(lead, LEAD, demo.password);
      const pack = await lead.evaluate(async (id) => (await fetch(`/api/bench/jobs/${id}`)).json(), jobId);
      const flags = (pack.flags as { stationId: string; reason: string; state: string }[]).filter(
        (f) => f.stationId === DECK[2],
      );
      expect(flags).toEqual([expect.objectContaining({ stationId: DECK[2], reason: "out_of_spec", state: "open" })]);
      const deck = (
        pack.readings as { stationId: string; supersededBy: string | null; value: number; verdict: string }[]
      ).filter((r) => r.stationId.startsWith("deck/"));
      expect(deck).toHaveLength(5);
      expect(
        deck
          .filter((r) => r.supersededBy === null)
          .map((r) => [r.stationId, r.value, r.verdict])
          .sort(),
      ).toEqual([
        [DECK[0], 9.025, "in_spec"],
        [DECK[1], 9.0255, "in_spec"],
        [DECK[2], 9.0311, "out_of_spec"],
        [DECK[3], 9.024, "in_spec"],
      ]);
    } finally {
      await browser.close();
    }
  });
});
