// The inspector's whole path in Chromium: see what blocks a release, have the machinist and the
// lead clear it through the APIs, sign in the browser (a wrong password first), see the lock,
// verify the record, see verification fail after a row is changed in MariaDB, read the audit.
import { randomUUID } from "node:crypto";
import { readFileSync } from "node:fs";
import { type APIRequestContext, type Browser, type Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiContext, launchBrowser, newTabletPage, screenshot, signIn } from "../support/browser";
import { prepareInspectorJob } from "./inspector-fixtures";
import { asOwner } from "../support/owner-db";

const demo = JSON.parse(readFileSync("scripts/demo-accounts.json", "utf8")) as {
  password: string;
  accounts: { role: string; name: string; email: string }[];
};
const account = (role: string) => demo.accounts.find((a) => a.role === role)!;
const LEFT_OUT = ["bore/1/top/A", "deck/block/rear"];
const PLAN = {
  lengthUnit: "in",
  bore: 3.5927,
  stroke: 3.75,
  rodLength: 6.5,
  compressionHeight: 1.675,
  pistonTop: "dish",
  pistonVolumeCc: 6,
  chamberCc: 68,
  gasketBore: 3.65,
  gasketThickness: 0.041,
  deckHeight: 9.38,
  intakeLobeLift: 0.27,
  exhaustLobeLift: 0.28,
  rockerRatio: 1.5,
};

let browser: Browser;
let page: Page;
let job: Awaited<ReturnType<typeof prepareInspectorJob>>;
const apis: APIRequestContext[] = [];

async function apiAs(role: string) {
  const ctx = await apiContext();
  apis.push(ctx);
  const res = await ctx.post("/api/session", { data: { email: account(role).email, password: demo.password } });
  expect(res.status()).toBe(200);
  return ctx;
}

const reading = (stationId: string, value: number, instrumentId: number) => ({
  id: randomUUID(),
  jobId: job.jobId,
  stationId,
  value,
  unit: "in",
  instrumentId,
  takenAt: new Date().toISOString(),
});

beforeAll(async () => {
  job = await prepareInspectorJob(LEFT_OUT);
  browser = await launchBrowser();
  page = (await newTabletPage(browser, { width: 1280, height: 900 })).page;
  await signIn(page, account("inspector").email, demo.password);
});
afterAll(async () => {
  for (const a of apis) await a.dispose();
  await browser?.close();
});

const state = () => page.getByTestId("checklist-state");

describe("the inspector's path", () => {
  it("sees what blocks release on a demo job", async () => {
    expect(new URL(page.url()).pathname).toBe("/release");
    const card = page.locator('[data-job="KF-2611"]');
    await expect.poll(() => card.textContent()).toMatch(/items block release/);
    await card.click();
    await page.waitForURL(/\/release\/\d+$/);
    await expect.poll(() => state().textContent()).toMatch(/^\d+ items block release$/);
    expect(await page.locator('[data-check="readings"]').getAttribute("data-ok")).toBe("false");
    expect(await page.getByRole("button", { name: "Sign and release" }).isDisabled()).toBe(true);
    await screenshot(page, "release-blocked-demo-job");
  });

  it("sees the prepared job's three blockers, then the machinist and the lead clear them", async () => {
    await page.goto(`/release/${job.jobId}`);
    await expect.poll(() => state().textContent()).toBe("3 items block release");
    expect(await page.locator('[data-item="readings:bore/1/top/A"]').textContent()).toMatch(
      /Cylinder 1 · top of bore · axis A \(thrust\): no reading yet/,
    );
    expect(await page.locator('[data-item="plan:none"] a').getAttribute("href")).toBe(`/desk/jobs/${job.jobId}/plan`);
    await screenshot(page, "release-blocked");

    const rosa = await apiAs("machinist");
    const pushed = await rosa.post("/api/sync", {
      data: {
        deviceId: "bench-tablet-2",
        readings: [
          reading("bore/1/top/A", 3.5927, job.gauges.bore),
          reading("deck/block/rear", 9.389, job.gauges.deck),
        ],
      },
    });
    expect(pushed.status()).toBe(200);
    await page.reload();
    await expect.poll(() => state().textContent()).toBe("2 items block release");
    const flagItem = page.locator('[data-check="flags"] [data-item^="flags:"]');
    expect(await flagItem.textContent()).toMatch(
      /Deck height at Deck · rear corner \(out of spec\): open, waiting for the lead's decision/,
    );
    const flagId = Number((await flagItem.getAttribute("data-item"))!.split(":")[1]);

    const dev = await apiAs("lead");
    const decided = await dev.post(`/api/flags/${flagId}/disposition`, {
      data: {
        kind: "accept",
        reason: "Rear deck 0.005 in over; within the head gasket maker's allowance, customer informed",
      },
    });
    expect(decided.status()).toBe(201);
    expect((await dev.put(`/api/jobs/${job.jobId}/build-plan`, { data: PLAN })).status()).toBe(200);
    await page.reload();
    await expect.poll(() => state().textContent()).toBe("Nothing blocks release");
  });

  it("refuses a wrong password, then signs; the job is locked and verifies", async () => {
    await page.getByLabel("Your full name").fill(account("inspector").name.toLowerCase());
    await page.getByLabel("Your password").fill("not-my-password");
    await page.getByRole("button", { name: "Sign and release" }).click();
    await expect
      .poll(() => page.getByRole("alert").first().textContent())
      .toMatch(/That password is not right, so nothing was signed/);
    expect(await page.getByLabel("Your full name").inputValue()).toBe(account("inspector").name.toLowerCase());

    await page.getByLabel("Your password").fill(demo.password);
    await page.getByRole("button", { name: "Sign and release" }).click();
    await expect.poll(() => page.getByText(/Released and locked since/).count()).toBe(1);
    await expect.poll(() => page.getByTestId("verification").getAttribute("data-status")).toBe("match");
    expect(await page.getByRole("button", { name: "Sign and release" }).count()).toBe(0);
    // Typed in lower case, shown as the account's registered name (the typed one is in the audit).
    expect(await page.locator('[data-release][data-status="standing"]').textContent()).toMatch(
      new RegExp(`Signed by ${account("inspector").name}`),
    );
    await screenshot(page, "release-released");

    const rosa = await apiAs("machinist");
    const late = await rosa.post("/api/sync", {
      data: { deviceId: "bench-tablet-2", readings: [reading("skirt/2", 3.5906, job.gauges.mic)] },
    });
    expect(late.status()).toBe(409);
    expect((await late.json()).results[0].reason).toMatch(/released .*readings are locked/);
  });

  it("opens the public verification, which fails once a released row is changed in MariaDB", async () => {
    await page.getByRole("link", { name: "Verification page", exact: true }).click();
    await page.waitForURL(/\/verify\?/);
    expect(await page.getByTestId("public-verification").getAttribute("data-status")).toBe("match");
    await screenshot(page, "verify-match");
    await asOwner(
      "UPDATE readings SET value_canonical = value_canonical + 0.0025 WHERE job_id = ? AND station_id = 'bore/3/mid/B'",
      [job.jobId],
    );
    await page.reload();
    expect(await page.getByTestId("public-verification").getAttribute("data-status")).toBe("changed");
    expect(await page.getByTestId("public-verification").textContent()).toMatch(/Changed since release/);
    await screenshot(page, "verify-changed");
    await page.goto(`/release/${job.jobId}`);
    await expect.poll(() => page.getByTestId("verification").getAttribute("data-status")).toBe("changed");
    expect(await page.getByTestId("verification").textContent()).toMatch(
      /Reading at Cylinder 3 · middle of bore · axis B \(pin\): changed/,
    );
  });

  it("finds the release, the decision and the plan in the audit trail", async () => {
    await page.goto(`/audit?job=${job.jobId}`);
    await expect.poll(() => page.locator("[data-action]").count()).toBeGreaterThan(2);
    const actions = await page
      .locator("[data-action]")
      .evaluateAll((rows) => rows.map((r) => r.getAttribute("data-action")));
    expect(actions).toEqual(expect.arrayContaining(["release.sign", "flag.accept", "job.build_plan"]));
    expect(actions[0]).toBe("release.sign");
    await screenshot(page, "audit");
  });

  it("shows the release as VOID, with the reason, once the lead reopens", async () => {
    const dev = await apiAs("lead");
    const reason = "Bore 3 mid B was changed behind the app; measure it again and release anew";
    expect((await dev.post(`/api/release/${job.jobId}/reopen`, { data: { reason } })).status()).toBe(200);
    await page.goto(`/release/${job.jobId}`);
    const voided = page.locator('[data-release][data-status="void"]');
    await expect.poll(() => voided.count()).toBe(1);
    expect(await voided.getByTestId("void-reason").textContent()).toMatch(
      new RegExp(`Voided .* by ${account("lead").name}\\. Reason: ${reason}`),
    );
    expect(await page.getByText("Released and locked since").count()).toBe(0);
    expect(await page.getByRole("button", { name: "Sign and release" }).count()).toBe(1);
    await screenshot(page, "release-void");
  });
});
