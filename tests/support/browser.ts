// Headless Debian Chromium through playwright-core, with the flags this machine needs.
import {
  chromium,
  request,
  type APIRequestContext,
  type Browser,
  type BrowserContext,
  type Page,
} from "playwright-core";
import { readFileSync } from "node:fs";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

export const BASE_URL = process.env.TW_BASE_URL ?? "http://127.0.0.1:3000";
export const CHROMIUM_ARGS = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: "/usr/bin/chromium", args: CHROMIUM_ARGS, headless: true });
}

/** A persistent profile (for offline/restart tests): same dir → same IndexedDB and service worker. */
export async function launchProfile(
  userDataDir = mkdtempSync(join(tmpdir(), "tw-profile-")),
  viewport = { width: 1024, height: 768 },
) {
  const context = await chromium.launchPersistentContext(userDataDir, {
    executablePath: "/usr/bin/chromium",
    args: CHROMIUM_ARGS,
    headless: true,
    viewport,
    baseURL: BASE_URL,
  });
  return { context, userDataDir };
}

export async function newTabletPage(
  browser: Browser,
  viewport = { width: 1024, height: 768 },
): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport, baseURL: BASE_URL });
  return { context, page: await context.newPage() };
}

export async function signIn(page: Page, email: string, password: string) {
  await page.goto("/sign-in", { waitUntil: "networkidle" }); // hydrated, so the form posts as JSON
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
}

export async function screenshot(page: Page, name: string) {
  await page.screenshot({ path: `tests/artifacts/${name}.png`, fullPage: true });
}

// The demo accounts the seed creates (scripts/demo-accounts.json), for signing in by role.
export const demo = JSON.parse(readFileSync("scripts/demo-accounts.json", "utf8")) as {
  password: string;
  accounts: { role: string; name: string; email: string }[];
};
export const demoEmail = (role: string) => demo.accounts.find((a) => a.role === role)!.email;

/**
 * A client of the API outside any page (a second person, a script), sending on every request the
 * Origin a browser puts on a page's own POST, since the server refuses changes naming no page of its own.
 */
export function apiContext(): Promise<APIRequestContext> {
  return request.newContext({ baseURL: BASE_URL, extraHTTPHeaders: { origin: new URL(BASE_URL).origin } });
}

/**
 * A change sent straight to the API (not from a page), with the Origin a browser puts on a page's
 * own POST; the server refuses a change that does not name one of its own pages.
 */
export function sendJson(
  request: APIRequestContext,
  method: "POST" | "PUT" | "PATCH" | "DELETE",
  url: string,
  data: unknown,
  headers: Record<string, string> = {},
) {
  return request.fetch(url, { method, data, headers: { ...headers, origin: new URL(BASE_URL).origin } });
}

/**
 * Signs the page's context in through the API (the sign-in form itself is tested in
 * sign-in.test.ts), so a test never races the form's hydration. Throws unless it worked.
 */
export async function signInAs(page: Page, address: string) {
  const res = await sendJson(page.context().request, "POST", "/api/session", {
    email: address,
    password: demo.password,
  });
  if (res.status() !== 200) throw new Error(`Sign-in as ${address} answered ${res.status()}`);
}
