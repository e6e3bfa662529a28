// `npm run bench:bundle`: the JavaScript a first visit to the bench job screen loads before the
// screen is ready to take an entry (gzipped here at zlib's default level), against an empty page
// of the same build (Next's not-found page: the root layout and nothing else), in Chromium with no
// service worker. Target: bench ≤ 1.5 × empty. What loads later (the sync engine, which the
// bench fetches after its first paint, and link prefetches) is printed apart, with the all-in ratio.
import { gzipSync } from "node:zlib";
import type { Page } from "playwright-core";
import { launch, signIn, startApp } from "./bench-app";

type Loaded = { url: string; raw: number; gzip: number; late: boolean };

/** Scripts of one page load; `late` marks those first asked for after the page was ready. */
async function scriptsOf(page: Page, go: () => Promise<void>): Promise<Loaded[]> {
  const seen = new Map<string, Loaded>();
  let ready = false;
  const asked = new Map<string, boolean>();
  const onRequest = (req: import("playwright-core").Request) => {
    if (req.resourceType() === "script" && !asked.has(req.url())) asked.set(req.url(), ready);
  };
  const onResponse = async (res: import("playwright-core").Response) => {
    if (res.request().resourceType() !== "script" || seen.has(res.url())) return;
    const body = await res.body().catch(() => null);
    if (body)
      seen.set(res.url(), {
        url: res.url(),
        raw: body.length,
        gzip: gzipSync(body).length,
        late: asked.get(res.url()) ?? true,
      });
  };
  page.on("request", onRequest);
  page.on("response", onResponse);
  await go();
  ready = true;
  await page.waitForLoadState("networkidle");
  await page.waitForTimeout(1500); // lazy chunks and prefetches, reported apart
  page.off("request", onRequest);
  page.off("response", onResponse);
  return [...seen.values()];
}

const kb = (n: number) => `${(n / 1024).toFixed(1).padStart(7)} KB`;
const total = (xs: Loaded[], k: "raw" | "gzip") => xs.reduce((s, x) => s + x[k], 0);

async function main() {
  const app = await startApp();
  const browser = await launch();
  try {
    const ctx = await browser.newContext({ viewport: { width: 1024, height: 768 }, serviceWorkers: "block" });
    const page = await ctx.newPage();
    await signIn(page, app.baseUrl, "rosa@kestrelflats.example", "bench-demo-2026");
    const { jobs } = (await page.evaluate(async () => (await fetch("/api/bench/jobs")).json())) as {
      jobs: { id: number; code: string }[];
    };
    const job = jobs.find((j) => j.code === "KF-2611") ?? jobs[0];

    // Each page in a fresh context (no HTTP cache shared), signed in with the same session cookie.
    const cookies = await ctx.cookies();
    async function firstLoad(path: string, ready?: (p: Page) => Promise<unknown>) {
      const c = await browser.newContext({ viewport: { width: 1024, height: 768 }, serviceWorkers: "block" });
      await c.addCookies(cookies);
      const p = await c.newPage();
      const got = await scriptsOf(p, async () => {
        await p.goto(`${app.baseUrl}${path}`);
        await ready?.(p);
      });
      await c.close();
      return got;
    }
    const bench = await firstLoad(`/bench/job?id=${job.id}`, (p) => p.getByTestId("job-screen").waitFor());
    const empty = await firstLoad("/tenthwise-bench-empty-page");

    const first = bench.filter((b) => !b.late);
    const later = bench.filter((b) => b.late);
    const emptyFirst = empty.filter((b) => !b.late);
    const ratio = total(first, "gzip") / total(emptyFirst, "gzip");
    console.log(
      "\nbench:bundle — first-load JavaScript (scripts asked for before the page is ready), " +
        "gzipped (zlib default level), Chromium, no service worker\n",
    );
    console.log(
      `bench job screen (/bench/job)   ${kb(total(first, "gzip"))} gzip  ${kb(total(first, "raw"))} raw  ${first.length} scripts`,
    );
    console.log(
      `empty page (not-found)          ${kb(total(emptyFirst, "gzip"))} gzip  ` +
        `${kb(total(emptyFirst, "raw"))} raw  ${emptyFirst.length} scripts`,
    );
    console.log(
      `ratio                           ${ratio.toFixed(2)}×  target ≤ 1.5× ${ratio <= 1.5 ? "met" : "NOT met"}`,
    );
    console.log(
      `loaded after the job screen was ready (sync engine, prefetches): ${kb(total(later, "gzip"))} gzip ` +
        `in ${later.length} scripts; ` +
        `all of it ${(total(bench, "gzip") / total(empty, "gzip")).toFixed(2)}× the empty page's\n`,
    );
    const emptyUrls = new Set(empty.map((e) => new URL(e.url).pathname));
    console.log("largest first-load scripts only the bench loads:");
    for (const s of first
      .filter((b) => !emptyUrls.has(new URL(b.url).pathname))
      .sort((a, b) => b.gzip - a.gzip)
      .slice(0, 8)) {
      console.log(`  ${kb(s.gzip)}  ${new URL(s.url).pathname}`);
    }
  } finally {
    await browser.close();
    await app.stop();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
