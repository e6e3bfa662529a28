// The customer's path: the e-mailed link opened in a fresh browser (no account, no cookies),
// the record summary read, the PDF downloaded; an expired link explains itself.
import { readFileSync } from "node:fs";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createCustomerToken } from "@/lib/server/release/customer-link";
import { runNotifierOnce } from "@/lib/server/notify/notifier";
import { launchBrowser, newTabletPage, screenshot, signIn } from "../support/browser";
import { TEST_PASSWORD } from "../support/factories";
import { pdfText } from "../support/pdf-text";
import { ACCEPT_REASON, createRecordJob, deliverFor } from "../support/record-fixtures";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("the customer's record link", () => {
  it("shows the record and downloads the PDF in a fresh browser", async () => {
    const job = await createRecordJob();
    const token = createCustomerToken(job.release!.id);
    const { context, page } = await newTabletPage(browser, { width: 1280, height: 900 });
    expect(await context.cookies()).toEqual([]);
    await page.goto(`/r/${token}`);
    await expect.poll(() => page.getByRole("heading", { name: `Build record ${job.job.code}` }).isVisible()).toBe(true);
    await expect
      .poll(() => page.getByTestId("release-state").innerText())
      .toContain(`Signed by ${job.release!.signedName}`);
    expect(await page.getByText(ACCEPT_REASON, { exact: false }).isVisible()).toBe(true);
    expect(await page.locator("[data-verdict=out_of_spec]").count()).toBeGreaterThan(0);
    await screenshot(page, "customer-record");

    const [download] = await Promise.all([
      page.waitForEvent("download"),
      page.getByRole("link", { name: /Download the full record/ }).click(),
    ]);
    expect(download.suggestedFilename()).toBe(`build-record-${job.job.code}.pdf`);
    const bytes = readFileSync((await download.path())!);
    expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
    expect((await pdfText(bytes)).text).toContain(job.release!.hash);

    // The page set no session, and the token opens nothing in the app.
    expect((await context.cookies()).map((c) => c.name)).not.toContain("tw_session");
    const api = await page.evaluate(
      async (t) => (await fetch(`/api/me?token=${t}`, { headers: { authorization: `Bearer ${t}` } })).status,
      token,
    );
    expect(api).toBe(401);
    await page.goto("/desk");
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await context.close();
  });

  it("says an expired link has expired and whom to ask; a changed one does not work", async () => {
    const job = await createRecordJob({ photo: false });
    const expired = createCustomerToken(job.release!.id, { ttlSeconds: 60, now: Date.now() - 3600_000 });
    const { context, page } = await newTabletPage(browser);
    await page.goto(`/r/${expired}`);
    await expect.poll(() => page.getByRole("heading", { name: "This link has expired" }).isVisible()).toBe(true);
    expect(await page.getByTestId("ask-shop").innerText()).toContain(job.shop.name);
    await screenshot(page, "customer-link-expired");
    await page.goto(`/r/${expired.slice(0, -3)}abc`);
    await expect.poll(() => page.getByRole("heading", { name: "This link does not work" }).isVisible()).toBe(true);
    await context.close();
  });

  it("lets the shop admin find the e-mailed record, PDF attached, in the local mail view", async () => {
    const job = await createRecordJob({ photo: false });
    await runNotifierOnce(); // queues the release's build record
    await deliverFor(job.shop.id); // and sends it to the fake SMTP server
    const { context, page } = await newTabletPage(browser, { width: 1280, height: 900 });
    await signIn(page, job.users.admin.email, TEST_PASSWORD);
    await page.goto("/admin/mail");
    const row = page.getByTestId("outbox-row").filter({ hasText: `Build record ${job.job.code}` });
    await expect.poll(() => row.innerText()).toMatch(/Sent \d{4}-\d{2}-\d{2}/);
    const message = page.getByTestId("mailbox-message").filter({ hasText: `Build record ${job.job.code}` });
    await message.locator("summary").click();
    const link = message.getByRole("link", { name: new RegExp(`build-record-${job.job.code}\\.pdf`) });
    expect(await link.isVisible()).toBe(true);
    await screenshot(page, "admin-mail");
    const pdf = await page.evaluate(
      async (href) => {
        const res = await fetch(href);
        return {
          status: res.status,
          type: res.headers.get("content-type"),
          head: new TextDecoder().decode((await res.arrayBuffer()).slice(0, 5)),
        };
      },
      (await link.getAttribute("href"))!,
    );
    expect(pdf).toEqual({ status: 200, type: "application/pdf", head: "%PDF-" });
    await context.close();
  });

  it("takes a photo upload in the running app and serves its preview", async () => {
    const job = await createRecordJob({ release: false, photo: false });
    const { context, page } = await newTabletPage(browser);
    await signIn(page, job.users.lead.email, TEST_PASSWORD);
    const out = await page.evaluate(async (jobId) => {
      const canvas = document.createElement("canvas");
      canvas.width = 640;
      canvas.height = 480;
      const g = canvas.getContext("2d")!;
      g.fillStyle = "#336699";
      g.fillRect(0, 0, 640, 480);
      const blob: Blob = await new Promise((r) => canvas.toBlob((b) => r(b!), "image/png"));
      const form = new FormData();
      form.set("file", new File([blob], "deck.png", { type: "image/png" }));
      form.set("ownerType", "job");
      form.set("ownerId", String(jobId));
      form.set("clientId", crypto.randomUUID());
      const up = await fetch("/api/attachments", { method: "POST", body: form });
      const body = await up.json();
      const thumb = await fetch(body.attachment.thumbUrl);
      const exe = new FormData();
      exe.set(
        "file",
        new File([new Uint8Array([0x4d, 0x5a, 0x90, 0, 3, 0, 0, 0, 4, 0, 0, 0, 0xff, 0xff, 0, 0])], "photo.jpg", {
          type: "image/jpeg",
        }),
      );
      exe.set("ownerType", "job");
      exe.set("ownerId", String(jobId));
      exe.set("clientId", crypto.randomUUID());
      const refused = await fetch("/api/attachments", { method: "POST", body: exe });
      return {
        status: up.status,
        type: body.attachment.contentType,
        thumb: thumb.status,
        thumbType: thumb.headers.get("content-type"),
        refused: refused.status,
        words: (await refused.json()).error.message,
      };
    }, job.job.id);
    expect(out).toMatchObject({ status: 201, type: "image/png", thumb: 200, thumbType: "image/jpeg", refused: 415 });
    expect(out.words).toContain("photo.jpg");
    await context.close();
  });
});
