// Two machinists on one shared tablet, in Chromium with the service worker: Rosa logs readings with
// no network and signs out with no network (the bench locks at once and says how many of hers wait);
// back online a second machinist signs in on the same tablet, works, and his session never sends
// Rosa's readings; Rosa signs in again and hers go out, stored as hers. No earlier session lingers:
// each signed-out cookie is refused by the server afterwards. Invented names.
import { randomUUID } from "node:crypto";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, describe, expect, it } from "vitest";
import {
  demo,
  demoEmail,
  launchBrowser,
  launchProfile,
  screenshot,
  sendJson,
  signIn,
  signInAs,
} from "../support/browser";
import { linkIn, waitForMails } from "../support/mailbox";

const ROSA = demoEmail("machinist");
const IVO = { name: "Ivo Marchetti", email: `ivo-${randomUUID().slice(0, 6)}@kestrelflats.example` };
const IVO_PASSWORD = "feeler gauge on the top ring";
// Demo V8 (KF-2611) piston skirts, 4.0285 in nominal (scripts/seed/demo-specs.ts, invented demo data):
// a section no other browser test logs, so the order the files run in does not matter.
const SKIRTS = ["skirt/1", "skirt/2", "skirt/3"];
const WAIT = { timeout: 30_000 };

let context: BrowserContext | undefined;
let browser: Browser | undefined;
afterAll(async () => {
  await context?.close().catch(() => undefined);
  await browser?.close().catch(() => undefined);
});

type PackReading = { stationId: string; takenBy: number };
const pending = (page: Page) => page.getByTestId("sync-badge").getAttribute("data-pending");
const station = (page: Page) => page.getByTestId("where").getAttribute("data-station");

async function tapValue(page: Page, text: string) {
  for (const ch of text)
    await page.getByRole("button", { name: ch === "." ? "Decimal point" : ch, exact: true }).click();
  await page.getByRole("button", { name: "Save", exact: true }).click();
}

/** Skirt readings the server holds for the job, asked with whatever session the page holds now. */
async function skirtsOnServer(page: Page, jobId: string): Promise<PackReading[]> {
  const pack = await page.evaluate(async (id) => (await fetch(`/api/bench/jobs/${id}`)).json(), jobId);
  return (pack.readings as PackReading[]).filter((r) => r.stationId.startsWith("skirt/"));
}

async function sessionCookie(ctx: BrowserContext): Promise<string> {
  const c = (await ctx.cookies()).find((k) => k.name === "tw_session");
  if (!c) throw new Error("No session cookie");
  return `${c.name}=${c.value}`;
}

/** What the server says about a cookie now, from a browser that holds nothing else. */
async function meStatus(cookie: string): Promise<number> {
  const other = await browser!.newContext({ baseURL: process.env.TW_BASE_URL });
  try {
    return (await other.request.get("/api/me", { headers: { cookie } })).status();
  } finally {
    await other.close();
  }
}

async function signInOnLockScreen(page: Page, email: string, password: string) {
  await page.getByTestId("sign-in").waitFor();
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((u) => u.pathname.startsWith("/bench"), WAIT);
}

describe("a shared tablet", () => {
  it("signs out offline, keeps each person's readings for their own next sign-in, and leaves no session", async () => {
    browser = await launchBrowser();
    const office = await (await browser.newContext({ baseURL: process.env.TW_BASE_URL })).newPage();
    await signInAs(office, demoEmail("admin"));
    const invited = await sendJson(office.context().request, "POST", "/api/users", { ...IVO, role: "machinist" });
    expect(invited.status()).toBe(201);
    const ivo = (await invited.json()) as { user: { id: number } };
    // Ivo chooses his password from the e-mailed invitation, as a new machinist would.
    const [invitation] = await waitForMails(IVO.email, 1);
    const chosen = await sendJson(office.context().request, "POST", "/api/password/set", {
      token: linkIn(invitation, "/set-password").token,
      password: IVO_PASSWORD,
    });
    expect(chosen.status()).toBe(200);

    context = (await launchProfile()).context;
    const page = context.pages()[0] ?? (await context.newPage());
    await signIn(page, ROSA, demo.password);
    const card = page.locator("a[data-job]", { hasText: "KF-2611" });
    await card.getByTestId("on-tablet").filter({ hasText: "Ready offline" }).waitFor(WAIT);
    const jobId = (await card.getAttribute("data-job"))!;
    await page.waitForFunction(() => navigator.serviceWorker?.controller !== null, undefined, { timeout: 60_000 });
    const rosaId = ((await page.evaluate(async () => (await fetch("/api/me")).json())) as { user: { id: number } }).user
      .id;
    const skirtsBefore = (await skirtsOnServer(page, jobId)).length;
    const rosaCookie = await sessionCookie(context);

    // Rosa measures two skirts with no network.
    await card.click();
    await page.getByTestId("job-screen").waitFor();
    await context.setOffline(true);
    await page.locator("[data-section=skirt]").click();
    await expect.poll(() => station(page)).toBe(SKIRTS[0]);
    await tapValue(page, "4.0285");
    await expect.poll(() => station(page)).toBe(SKIRTS[1]);
    await tapValue(page, "4.0286");
    await expect.poll(() => pending(page)).toBe("2");

    // She signs out, still offline: the bench locks behind the sign-in screen and says what waits.
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.getByTestId("sign-in").waitFor(WAIT);
    const notice = page.getByTestId("signed-out-notice");
    expect(await notice.getAttribute("data-waiting")).toBe("2");
    expect(await notice.textContent()).toContain("2 readings by Rosa Calloway wait on this tablet");
    expect(await page.getByTestId("sign-in-offline").count()).toBe(1);
    expect(await page.getByTestId("job-screen").count()).toBe(0);
    expect(await page.getByTestId("whoami").count()).toBe(0);
    await screenshot(page, "shared-tablet-locked-offline-1024x768");
    // Opening the bench again offline, from the cache, still shows only the sign-in screen.
    await page.goto(`/bench/job?id=${jobId}`);
    await page.getByTestId("sign-in").waitFor(WAIT);
    expect(await page.getByTestId("job-screen").count()).toBe(0);

    // Back online, the locked tablet ends Rosa's session on the server by itself.
    await context.setOffline(false);
    await expect.poll(() => meStatus(rosaCookie), WAIT).toBe(401);
    // Ivo signs in on the same tablet and saves one reading of his own.
    await signInOnLockScreen(page, IVO.email, IVO_PASSWORD);
    await expect.poll(() => page.getByTestId("whoami").textContent(), WAIT).toContain(IVO.name);
    await page.goto(`/bench/job?id=${jobId}`);
    await page.getByTestId("job-screen").waitFor();
    await page.locator("[data-section=skirt]").click();
    // Rosa's two readings are on this tablet too, so the section opens at the next station.
    await expect.poll(() => station(page)).toBe(SKIRTS[2]);
    await tapValue(page, "4.0284");
    // Stored on the tablet first (the route moves on), then sent: a badge at 0 alone could be the old one.
    await expect.poll(() => station(page)).not.toBe(SKIRTS[2]);
    await expect.poll(async () => (await skirtsOnServer(page, jobId)).length, WAIT).toBe(skirtsBefore + 1);
    await expect.poll(() => pending(page), WAIT).toBe("0");
    await expect.poll(() => page.getByTestId("sync-badge").textContent(), WAIT).toContain("All sent");
    expect(await page.getByTestId("sync-badge").textContent()).toContain("2 by another person wait for their sign-in");
    const afterIvo = await skirtsOnServer(page, jobId);
    expect(afterIvo.length).toBe(skirtsBefore + 1);
    expect(afterIvo.filter((r) => r.takenBy === rosaId && SKIRTS.slice(0, 2).includes(r.stationId))).toEqual([]);
    expect(afterIvo.filter((r) => r.takenBy === ivo.user.id).map((r) => r.stationId)).toEqual([SKIRTS[2]]);
    const ivoCookie = await sessionCookie(context);

    // Ivo signs out online; Rosa signs in again and her two readings go out as hers.
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL((u) => u.pathname.startsWith("/sign-in"), WAIT);
    await page.getByTestId("waiting-here").filter({ hasText: "Rosa Calloway: 2 readings" }).waitFor(WAIT);
    expect(await meStatus(ivoCookie)).toBe(401);
    await signInOnLockScreen(page, ROSA, demo.password);
    await page.getByTestId("sync-badge").waitFor(WAIT);
    await expect.poll(async () => (await skirtsOnServer(page, jobId)).length, WAIT).toBe(skirtsBefore + 3);
    await expect.poll(() => page.getByTestId("sync-badge").textContent(), WAIT).toContain("All sent");
    const final = await skirtsOnServer(page, jobId);
    expect(final.length).toBe(skirtsBefore + 3);
    expect(
      final
        .filter((r) => r.takenBy === rosaId)
        .map((r) => r.stationId)
        .filter((s) => SKIRTS.slice(0, 2).includes(s))
        .sort(),
    ).toEqual(SKIRTS.slice(0, 2));
    expect(await page.getByTestId("sync-badge").textContent()).not.toContain("another person");
    expect(await meStatus(rosaCookie)).toBe(401);
  });
});
