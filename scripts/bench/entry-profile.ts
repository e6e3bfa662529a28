// `npx tsx scripts/bench/entry-profile.ts`: where an Enter's time goes on the bench job screen.
// Twenty in-spec bore entries, offline, CPU throttled 4x, recorded as a DevTools trace (with
// layout and style invalidation tracking) and a CPU profile, written to TW_PROFILE_DIR (default
// /tmp): open both in DevTools' Performance panel. With a source-mapped build
// (DEVELOPERS.md, "Profiling") the profile's frames map back to the source files.
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { launch, signIn, startApp } from "./bench-app";

async function main() {
  const app = await startApp();
  const browser = await launch();
  try {
    const ctx = await browser.newContext({ viewport: { width: 1024, height: 768 } });
    const page = await ctx.newPage();
    await signIn(page, app.baseUrl, "rosa@kestrelflats.example", "bench-demo-2026");
    const { jobs } = (await page.evaluate(async () => (await fetch("/api/bench/jobs")).json())) as {
      jobs: { id: number; code: string }[];
    };
    const job = jobs.find((j) => j.code === "KF-2611") ?? jobs[0];
    await page.goto(`${app.baseUrl}/bench/job?id=${job.id}`);
    await page.getByTestId("job-screen").waitFor();
    await page.locator("[data-section=bore]").click();
    await page.context().setOffline(true);
    await page.getByTestId("entry").focus();
    const cdp = await ctx.newCDPSession(page);
    await cdp.send("Emulation.setCPUThrottlingRate", { rate: 4 });
    for (let i = 0; i < 5; i++) {
      await page.keyboard.type("4.0302");
      await page.keyboard.press("Enter");
      await page.waitForTimeout(300);
    }
    await cdp.send("Profiler.enable");
    await cdp.send("Profiler.setSamplingInterval", { interval: 100 });
    const events: unknown[] = [];
    cdp.on("Tracing.dataCollected", (d) => void events.push(...(d.value as unknown[])));
    await cdp.send("Tracing.start", {
      categories:
        "devtools.timeline,blink.user_timing,disabled-by-default-devtools.timeline," +
        "disabled-by-default-devtools.timeline.invalidationTracking",
      transferMode: "ReportEvents",
    });
    await cdp.send("Profiler.start");
    for (let i = 0; i < 20; i++) {
      await page.keyboard.type("4.0302");
      await page.evaluate(() => performance.mark("tw:before-enter"));
      await page.keyboard.press("Enter");
      await page.waitForTimeout(300);
    }
    const { profile } = await cdp.send("Profiler.stop");
    const done = new Promise((r) => cdp.once("Tracing.tracingComplete", r));
    await cdp.send("Tracing.end");
    await done;
    const dir = process.env.TW_PROFILE_DIR || "/tmp";
    writeFileSync(join(dir, "entry.cpuprofile"), JSON.stringify(profile));
    writeFileSync(join(dir, "entry-trace.json"), JSON.stringify(events));
    console.log(`Wrote ${join(dir, "entry.cpuprofile")} and ${join(dir, "entry-trace.json")}`);
  } finally {
    await browser.close();
    await app.stop();
  }
}
main().catch((e) => {
  console.error(e);
  process.exit(1);
});
