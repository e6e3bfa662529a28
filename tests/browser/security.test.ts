// The edge as a browser and a plain client meet it on the built app: the main screens run under
// the Content-Security-Policy with no violation (scripts, styles, fonts, photos, charts, the
// service worker, the record's PDF), and every kind of response carries the security headers.
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createCustomerToken } from "@/lib/server/release/customer-link";
import { BASE_URL, demoEmail, launchBrowser, newTabletPage, sendJson, signInAs } from "../support/browser";
import { TEST_PASSWORD } from "../support/factories";
import { createRecordJob, type RecordJob } from "../support/record-fixtures";

let browser: Browser;
let record: RecordJob;
beforeAll(async () => {
  browser = await launchBrowser();
  record = await createRecordJob();
});
afterAll(async () => {
  await browser?.close();
});

/** A page that records every CSP violation: the console's words and the DOM's events. */
async function watched(context: BrowserContext): Promise<{ page: Page; violations: string[] }> {
  const violations: string[] = [];
  await context.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) =>
      console.error(`Content Security Policy event: ${e.violatedDirective} blocked ${e.blockedURI || "inline"}`),
    );
  });
  const page = context.pages()[0] ?? (await context.newPage());
  page.on("console", (m) => {
    if (m.text().includes("Content Security Policy")) violations.push(`${page.url()}: ${m.text()}`);
  });
  return { page, violations };
}

async function visit(page: Page, path: string) {
  await page.goto(path, { waitUntil: "networkidle", timeout: 90_000 });
  await page.waitForFunction(() => !document.querySelector("[aria-busy=true]"), null, { timeout: 15_000 });
}

async function signedIn(email: string, password?: string) {
  const { context, page: first } = await newTabletPage(browser, { width: 1280, height: 900 });
  await first.close();
  const { page, violations } = await watched(context);
  if (password) {
    const res = await sendJson(context.request, "POST", "/api/session", { email, password });
    expect(res.status()).toBe(200);
  } else if (email) await signInAs(page, email);
  return { context, page, violations };
}

describe("the Content-Security-Policy, as the screens meet it", () => {
  it("sign-in (with the saved dim theme applied by its nonced script) and the customer's record link", async () => {
    const { context, page, violations } = await signedIn("");
    await context.addInitScript(() => localStorage.setItem("tw-theme", "dim"));
    await visit(page, "/sign-in");
    expect(await page.evaluate(() => document.documentElement.classList.contains("dim"))).toBe(true);
    await page.getByLabel("E-mail").fill("nobody@example.com");
    await visit(page, `/r/${createCustomerToken(record.release!.id)}`);
    await expect.poll(() => page.getByRole("heading", { name: /Build record/ }).isVisible()).toBe(true);
    const [download] = await Promise.all([
      page.waitForEvent("download"),
      page.getByRole("link", { name: /Download the full record/ }).click(),
    ]);
    expect(download.suggestedFilename()).toMatch(/\.pdf$/);
    expect(violations).toEqual([]);
    await context.close();
  });

  it("the desk: jobs, a job, its charts, a flag with its photo; the release page and the record's PDF", async () => {
    const lead = await signedIn(record.users.lead.email, TEST_PASSWORD);
    const job = record.job.id;
    for (const path of ["/desk", `/desk/jobs/${job}`, `/desk/jobs/${job}/maps`, `/desk/flags/${record.flagId}`]) {
      await visit(lead.page, path);
    }
    expect(await lead.page.locator("svg").count()).toBeGreaterThan(0);
    expect(lead.violations).toEqual([]);
    await lead.context.close();

    const inspector = await signedIn(record.users.inspector.email, TEST_PASSWORD);
    await visit(inspector.page, `/release/${job}`);
    const photo = inspector.page.locator("img[src^='/api/attachments'], img[src^='blob:']").first();
    if (await photo.count())
      await expect.poll(() => photo.evaluate((i: HTMLImageElement) => i.naturalWidth)).toBeGreaterThan(0);
    // The office opens the record inline: the browser's PDF viewer runs under the policy too.
    await inspector.page.goto(`/api/record/${job}/pdf`);
    await expect.poll(() => inspector.page.frames().some((f) => f.url().startsWith("chrome-extension://"))).toBe(true);
    expect(inspector.violations).toEqual([]);
    await inspector.context.close();
  });

  it("the bench: job list, a job screen, and the service worker in control", async () => {
    const { context, page, violations } = await signedIn(demoEmail("machinist"));
    await visit(page, "/bench");
    const jobs = (await (await context.request.get("/api/bench/jobs")).json()) as { jobs: { id: number }[] };
    await visit(page, `/bench/job?id=${jobs.jobs[0].id}`);
    await page.waitForFunction(() => navigator.serviceWorker?.controller !== null, undefined, { timeout: 60_000 });
    expect(violations).toEqual([]);
    await context.close();
  });
});

const HEADERS = ["content-security-policy", "x-content-type-options", "referrer-policy", "x-frame-options"];

async function headersOf(path: string, init: RequestInit = {}) {
  const res = await fetch(new URL(path, BASE_URL), { redirect: "manual", ...init });
  await res.arrayBuffer();
  return { status: res.status, h: res.headers };
}

describe("security headers on every response", () => {
  it("pages, API answers, errors, 404s, static files, the worker and redirects all carry them", async () => {
    const page = await (await fetch(new URL("/sign-in", BASE_URL))).text();
    const chunk = page.match(/src="(\/_next\/static\/[^"]+\.js)"/)![1];
    const samples: [string, RequestInit?][] = [
      ["/sign-in"],
      ["/bench"],
      ["/desk"], // a redirect to sign-in
      ["/no-such-page"],
      ["/api/me"], // 401 in the envelope
      ["/api/no-such-route"],
      ["/api/customers", { method: "POST", headers: { origin: "http://evil.example" }, body: "{}" }],
      [chunk],
      ["/icons/icon.svg"],
      ["/sw.js"],
      ["/manifest.webmanifest"],
      ["/api/r/not-a-token/pdf"],
    ];
    for (const [path, init] of samples) {
      const { status, h } = await headersOf(path, init);
      const missing = HEADERS.filter((name) => !h.get(name));
      expect({ path, status, missing }).toEqual({ path, status, missing: [] });
      expect(h.get("content-security-policy")).toContain("frame-ancestors 'none'");
      expect(h.get("content-security-policy")).not.toMatch(/script-src[^;]*'unsafe-inline'/);
      expect(h.get("x-content-type-options")).toBe("nosniff");
      // Plain http here: no HSTS, and nothing upgraded to a port that is not there.
      expect(h.get("strict-transport-security")).toBeNull();
      expect(h.get("content-security-policy")).not.toContain("upgrade-insecure-requests");
    }
    expect((await headersOf("/api/customers", samples[6][1])).status).toBe(403);
    expect((await headersOf("/sign-in")).h.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
    expect((await headersOf("/r/some-token")).h.get("referrer-policy")).toBe("no-referrer");
    expect((await headersOf("/api/r/some-token/pdf")).h.get("referrer-policy")).toBe("no-referrer");
  });

  it("gives each page load its own nonce, and the page's scripts carry it", async () => {
    const nonces: string[] = [];
    for (let i = 0; i < 2; i++) {
      const res = await fetch(new URL("/sign-in", BASE_URL));
      const nonce = res.headers.get("content-security-policy")!.match(/'nonce-([^']+)'/)![1];
      const html = await res.text();
      expect(html).toContain(`nonce="${nonce}"`);
      expect(html).not.toMatch(/<script(?![^>]*nonce=)[^>]*>/);
      nonces.push(nonce);
    }
    expect(nonces[0]).not.toBe(nonces[1]);
  });

  it("refuses a JSON body sent as text/plain, through the whole server", async () => {
    const res = await fetch(new URL("/api/session", BASE_URL), {
      method: "POST",
      headers: { origin: new URL(BASE_URL).origin, "content-type": "text/plain" },
      body: JSON.stringify({ email: "a@b.example", password: "x" }),
    });
    expect(res.status).toBe(415);
    expect(((await res.json()) as { error: { code: string } }).error.code).toBe("unsupported_media");
  });
});
