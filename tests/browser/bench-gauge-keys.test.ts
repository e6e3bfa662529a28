// A gauge that types (a USB or Bluetooth keyboard wedge) sends digits, then Enter, into whatever
// has the focus. In Chromium, with the server not reachable though the network is up (the sync
// route refused), the machinist taps around the bench (change gauge, dial mode, section strip,
// all stations, skip sheet closed, photo taken, lubricant, a tap on the page itself) and after
// each tap the gauge sends a figure with no tap on the field. The badge says the server is not
// reachable (never "Online"), the bar does not move as readings queue, and once the server is
// back every figure is found among the server's readings.
import type { BrowserContext, Page } from "playwright-core";
import { afterAll, describe, expect, it } from "vitest";
import { BASE_URL, demo, launchBrowser, screenshot, signIn } from "../support/browser";
import { demoV8Figure } from "../../scripts/seed/demo-figures";

const ROSA = "rosa@kestrelflats.example";
let context: BrowserContext | undefined;
afterAll(async () => {
  await context
    ?.browser()
    ?.close()
    .catch(() => undefined);
});

const seq = (page: Page) => page.getByTestId("last-entry").getAttribute("data-seq");
const station = (page: Page) => page.getByTestId("where").getAttribute("data-station");
/** Where the entry field sits on the page (not in the window, which scrolls with a station move). */
const entryTop = (page: Page) =>
  page.evaluate(() => document.getElementById("tw-entry")!.getBoundingClientRect().top + window.scrollY);

/** The gauge's keystrokes and Enter, into whatever has the focus; a reading shows a new verdict card. */
async function gaugeSends(page: Page, text: string, reading = true) {
  const before = await seq(page);
  await page.keyboard.type(text);
  await page.keyboard.press("Enter");
  if (reading)
    await expect
      .poll(() => seq(page), { timeout: 10_000 })
      .not.toBe(before)
      .catch(async () => {
        const note = await page.getByTestId("entry-note").textContent();
        const focus = await page.evaluate(() => document.activeElement?.outerHTML.slice(0, 80));
        throw new Error(`No reading saved for ${text} at ${await station(page)}: "${note}"; focus on ${focus}`);
      });
  else await expect.poll(() => page.getByTestId("entry").inputValue()).toBe("");
}

type ServerReading = { stationId: string; value: number | null; takenBy: number };
async function serverReadings(page: Page, jobId: string): Promise<ServerReading[]> {
  return page.evaluate(async (id) => (await (await fetch(`/api/bench/jobs/${id}`)).json()).readings, jobId);
}

describe("gauge keystrokes after every tap on the bench", () => {
  it("are all stored, with the server unreachable meanwhile and the bar still", async () => {
    const browser = await launchBrowser();
    context = await browser.newContext({
      viewport: { width: 1024, height: 768 },
      baseURL: BASE_URL,
      serviceWorkers: "block", // this test is about the focus, not the offline shell
    });
    const page = await context.newPage();
    await signIn(page, ROSA, demo.password);
    const card = page.locator("a[data-job]", { hasText: "KF-2611" });
    const jobId = (await card.getAttribute("data-job"))!;
    const before = (await serverReadings(page, jobId)).length;
    await context.route("**/api/sync**", (route) => route.abort("connectionrefused"));
    await page.goto(`/bench/job?id=${jobId}`);
    await page.getByTestId("job-screen").waitFor();
    await expect.poll(() => station(page)).toMatch(/^bore\//); // the route opens on an open bore station
    const badge = page.getByTestId("sync-badge");
    await expect.poll(() => badge.getAttribute("data-connection"), { timeout: 30_000 }).toBe("unreachable");
    expect(await badge.textContent()).not.toContain("Online");
    const top = await entryTop(page);
    await screenshot(page, "bench-gauge-keys-start-1024x768");
    const typed: string[] = [];
    /** The gauge sends the usual figure for the station on screen; a dial reading is given as such. */
    const send = async (dialReading?: string) => {
      const text = dialReading ?? demoV8Figure((await station(page))!);
      typed.push(text);
      await gaugeSends(page, text);
    };

    await page.getByRole("button", { name: "Change gauge" }).click();
    await page.getByRole("button", { name: /Dial bore gauge/ }).click();
    await send();
    await page.getByRole("button", { name: "Dial mode off" }).click();
    await page.getByRole("button", { name: "Set size" }).waitFor(); // dial mode is kept with the job
    await gaugeSends(page, "4.0300", false); // the setting size the dial was zeroed on
    await page.getByRole("button", { name: "Save", exact: true }).waitFor(); // the size is kept: dial readings now
    await send("0.0002"); // a dial reading: the diameter is worked out from the setting
    await page.getByRole("button", { name: "Dial mode on" }).click();
    await page.getByRole("button", { name: "Dial mode off" }).waitFor();
    await send();

    await page.getByRole("button", { name: "All stations" }).click();
    await page.locator('[role=dialog] [data-station="ring-gap/8/oil"]').click();
    await expect.poll(() => station(page)).toBe("ring-gap/8/oil");
    await send();

    await page.getByRole("button", { name: "Skip…" }).click();
    await page.getByRole("button", { name: "Back to measuring" }).click();
    await send();

    const chooser = page.waitForEvent("filechooser");
    await page.locator("label", { has: page.locator("input[type=file]") }).click();
    // The smallest JPEG header is enough: the tablet keeps the photo as the camera gave it.
    await (await chooser).setFiles({ name: "bore.jpg", mimeType: "image/jpeg", buffer: Buffer.from([255, 216, 255]) });
    await expect.poll(() => badge.getAttribute("data-photos")).toBe("1");
    await send();

    await page.getByTestId("where").locator("h2").click(); // a tap on the page, not on a control
    await expect.poll(() => page.evaluate(() => document.activeElement?.id)).toBe("tw-entry");
    // Focus somewhere else on the bench (here: nowhere): the figure's first key brings it back.
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    expect(await page.evaluate(() => document.activeElement === document.body)).toBe(true);
    await send();

    await page.locator("[data-section=torque]").click();
    await expect.poll(() => station(page)).toMatch(/^torque\//);
    await page.getByRole("button", { name: "Engine oil" }).click();
    await page.getByRole("button", { name: "Engine oil", pressed: true }).waitFor(); // kept with the job
    await send();

    const taken = typed.length;
    await expect.poll(() => badge.getAttribute("data-pending")).toBe(String(taken));
    expect(await badge.getAttribute("data-connection")).toBe("unreachable");
    await screenshot(page, "bench-gauge-keys-queued-1024x768");
    expect(await entryTop(page)).toBe(top); // queued readings and the error line move nothing

    await context.unroute("**/api/sync**");
    await page.getByRole("button", { name: "Send now" }).click();
    await expect.poll(() => badge.getAttribute("data-pending"), { timeout: 60_000 }).toBe("0");
    await expect.poll(() => badge.getAttribute("data-connection"), { timeout: 30_000 }).toBe("reachable");
    const after = await serverReadings(page, jobId);
    expect(after.length - before).toBe(taken);
    const values = after.map((r) => String(r.value));
    for (const v of typed.filter((t) => t !== "0.0002")) expect(values).toContain(String(Number(v)));
    expect(values).toContain("4.0298"); // the dial reading: 4.0300 set, +0.0002 on a plus-means-smaller dial
  });
});
