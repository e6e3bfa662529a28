// The three kinds of mail, end to end through the fake SMTP server that `npm test` starts: each
// message is read back from MAIL_DIR (.eml) with mailparser. The app under test runs its own
// notifier too, so every check is on the end state (the message arrived, once), whoever sent it.
import { randomUUID } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { simpleParser, type ParsedMail } from "mailparser";
import nodemailer from "nodemailer";
import { describe, expect, it } from "vitest";
import { GET as outboxList } from "@/app/api/mail/outbox/route";
import { POST as retry } from "@/app/api/mail/outbox/[id]/retry/route";
import { checkCustomerToken } from "@/lib/server/release/customer-link";
import { recordChange } from "@/lib/server/sync/repo";
import { getSequelize } from "@/lib/server/core/db";
import { listMailFiles } from "@/lib/server/mail/files";
import { enqueueReleaseMail } from "@/lib/server/mail/outbox";
import { deliverPendingMail, retryDelaySeconds } from "@/lib/server/mail/outbox-worker";
import { runNotifierOnce } from "@/lib/server/notify/notifier";
import { releaseChecklist } from "@/lib/server/release/checklist";
import { Flag, Job, MailOutbox, Reading } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { pdfText } from "../support/pdf-text";
import { BUILD_PLAN, createRecordJob, deliverFor } from "../support/record-fixtures";
import { asUser, call } from "../support/requests";
import { asOwner } from "../support/owner-db";

const MAIL_DIR = process.env.MAIL_DIR!;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function mailsTo(address: string): Promise<ParsedMail[]> {
  const out: ParsedMail[] = [];
  for (const name of readdirSync(MAIL_DIR).filter((n) => n.endsWith(".eml"))) {
    const m = await simpleParser(readFileSync(join(MAIL_DIR, name)));
    const to = Array.isArray(m.to) ? m.to.map((a) => a.text).join(",") : (m.to?.text ?? "");
    if (to.includes(address)) out.push(m);
  }
  return out;
}

/** The messages to an address once `n` have arrived (the app's own worker may be mid-send). */
async function waitForMails(address: string, n: number, timeoutMs = 15_000): Promise<ParsedMail[]> {
  const until = Date.now() + timeoutMs;
  let mails = await mailsTo(address);
  while (mails.length < n && Date.now() < until) {
    await sleep(250);
    mails = await mailsTo(address);
  }
  return mails;
}

async function addFlag(s: TestShop, stationId: string, value: number) {
  return Flag.create({
    shopId: s.shop.id,
    jobId: s.job.id,
    stationId,
    characteristic: "bore_diameter",
    value,
    unit: "in",
    limitMin: 4.0295,
    limitMax: 4.0305,
    deviation: Number((value - 4.03).toFixed(6)),
    verdict: "out_of_spec",
    reason: "out_of_spec",
  });
}

describe("mail through the outbox", () => {
  it("sends the build record to the customer on release, with the PDF attached and a working link, once", async () => {
    const job = await createRecordJob({ photo: false });
    const customer = `customer-${job.job.code.slice(2)}@test.example`;
    await runNotifierOnce(); // catches the release: nobody queued its mail
    await runNotifierOnce();
    await deliverFor(job.shop.id);
    const mails = await waitForMails(customer, 1);
    expect(mails).toHaveLength(1);
    const m = mails[0];
    expect(m.subject).toBe(`Build record ${job.job.code}: Test job ${job.job.code.slice(2)}`);
    expect(m.headers.get("x-tenthwise-kind")).toBe("build_record");
    expect(m.attachments).toHaveLength(1);
    expect(m.attachments[0].contentType).toBe("application/pdf");
    expect(m.attachments[0].filename).toBe(`build-record-${job.job.code}.pdf`);
    const pdf = await pdfText(m.attachments[0].content);
    expect(pdf.text).toContain(job.release!.hash);
    expect(pdf.text).toContain("RELEASED FOR ASSEMBLY");
    const link = m.text!.match(/https?:\/\/\S+\/r\/(r1\.\d+\.\d+\.[\w-]+)/);
    expect(link).not.toBeNull();
    const check = checkCustomerToken(link![1]);
    expect(check.ok && check.releaseId).toBe(job.release!.id);
    expect(m.text).toContain(job.release!.hash);
  });

  it("enqueueReleaseMail queues once per release, in the caller's transaction", async () => {
    const job = await createRecordJob({ photo: false });
    const o = { shopId: job.shop.id, jobId: job.job.id, releaseId: job.release!.id };
    const first = await getSequelize().transaction((t) => enqueueReleaseMail(t, o));
    const again = await getSequelize().transaction((t) => enqueueReleaseMail(t, o));
    expect([first, again]).toEqual([true, false]);
    await runNotifierOnce();
    expect(await MailOutbox.count({ where: { shopId: job.shop.id, kind: "build_record" } })).toBe(1);
    // A rolled-back release leaves no mail behind.
    const other = await createRecordJob({ photo: false });
    await getSequelize()
      .transaction(async (t) => {
        await enqueueReleaseMail(t, { shopId: other.shop.id, jobId: other.job.id, releaseId: other.release!.id });
        throw new Error("the signature failed after the mail was queued");
      })
      .catch(() => {});
    expect(await MailOutbox.count({ where: { shopId: other.shop.id } })).toBe(0);
  });

  it("sends the leads a digest of new flags, then only the flags since that digest", async () => {
    const s = await createShop();
    await addFlag(s, "bore/3/top/A", 4.0311);
    await addFlag(s, "bore/4/mid/B", 4.029);
    await runNotifierOnce();
    await deliverFor(s.shop.id);
    let mails = await waitForMails(s.users.lead.email, 1);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe(`2 new flags to review: ${s.job.code}`);
    expect(mails[0].text).toContain(
      "Cylinder 3 · top of bore · axis A (thrust): cylinder bore diameter 4.0311 in (limits 4.0295 to 4.0305 in), OUT OF SPEC",
    );
    expect(mails[0].text).toContain("/desk/flags");
    expect(await mailsTo(s.users.inspector.email)).toHaveLength(0);

    await addFlag(s, "bore/5/top/B", 4.0312);
    await runNotifierOnce();
    await runNotifierOnce();
    await deliverFor(s.shop.id);
    mails = await waitForMails(s.users.lead.email, 2);
    expect(mails).toHaveLength(2);
    const second = mails.find((m) => m.subject?.startsWith("1 new flag"))!;
    expect(second.text).toContain("Cylinder 5");
    expect(second.text).not.toContain("Cylinder 3");
  });

  it("tells the inspectors when a job's checklist turns complete, once per spec revision", async () => {
    const s = await createShop();
    await asOwner("UPDATE job_limits SET required = 0 WHERE job_id = ?", [s.job.id]);
    await Job.update({ buildPlan: BUILD_PLAN, status: "review" }, { where: { id: s.job.id } });
    await runNotifierOnce();
    expect(await mailsTo(s.users.inspector.email)).toHaveLength(0); // torque records still missing
    for (const group of ["main-caps", "rod-bolts", "head-bolts", "flywheel", "damper"]) {
      const id = randomUUID();
      await recordChange(null, { shopId: s.shop.id, jobId: s.job.id, entity: "reading", entityId: id });
      await Reading.create({
        id,
        shopId: s.shop.id,
        jobId: s.job.id,
        stationId: `torque/${group}`,
        characteristic: "fastener_torque",
        value: 68,
        unit: "lbf_ft",
        lubricant: "engine-oil",
        instrumentId: s.gauges.torque,
        takenBy: s.users.machinist.id,
        takenAt: new Date(),
        deviceId: "t",
        verdict: "in_spec",
        limitMin: 65,
        limitMax: 70,
      });
    }
    expect((await releaseChecklist(s.shop.id, s.job.id)).complete).toBe(true);
    await runNotifierOnce();
    await runNotifierOnce();
    await deliverFor(s.shop.id);
    let mails = await waitForMails(s.users.inspector.email, 1);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe(`Ready for release: ${s.job.code}, Test job ${s.job.code.slice(2)}`);
    expect(mails[0].text).toContain(`/release/${s.job.id}`);
    expect(await mailsTo(s.users.lead.email)).toHaveLength(0);
    await Job.update({ specRevision: 2 }, { where: { id: s.job.id } }); // as a limits edit does
    await runNotifierOnce();
    await deliverFor(s.shop.id);
    mails = await waitForMails(s.users.inspector.email, 2);
    expect(mails).toHaveLength(2);
  });
});

describe("failed mail", () => {
  it("records the error, retries with a doubling delay, and shows it to the admin", async () => {
    const s = await createShop();
    const later = new Date(Date.now() + 3600_000); // not due for the app's own worker
    const row = await MailOutbox.create({
      shopId: s.shop.id,
      kind: "flag_digest",
      toAddress: s.users.lead.email,
      subject: "Test digest",
      payload: { text: "Hello" },
      nextAttemptAt: later,
    });
    const dead = nodemailer.createTransport({ host: "127.0.0.1", port: 1, connectionTimeout: 2000 });
    const first = await deliverPendingMail({
      now: later,
      only: [row.id],
      send: (m) => dead.sendMail({ from: "t@test.example", ...m }),
    });
    expect(first.failed.map((f) => f.id)).toContain(row.id);
    await row.reload();
    expect(row.sentAt).toBeNull();
    expect(row.attempts).toBe(1);
    expect(row.lastError).toMatch(/Attempt 1 at .*ECONNREFUSED/);
    expect(row.nextAttemptAt.getTime() - later.getTime()).toBe(retryDelaySeconds(1) * 1000);
    await deliverPendingMail({
      now: row.nextAttemptAt,
      only: [row.id],
      send: () => Promise.reject(new Error("451 try later")),
    });
    await row.reload();
    expect(row.attempts).toBe(2);
    expect(retryDelaySeconds(2)).toBe(2 * retryDelaySeconds(1));
    expect(retryDelaySeconds(40)).toBe(6 * 3600);

    const listed = await call(outboxList, await asUser(s.users.admin, "GET", "/api/mail/outbox"));
    expect(listed.body.messages[0]).toMatchObject({ id: row.id, attempts: 2, sentAt: null });
    expect(listed.body.messages[0].lastError).toContain("451 try later");
    expect((await call(outboxList, await asUser(s.users.lead, "GET", "/api/mail/outbox"))).status).toBe(403);
    const other = await createShop();
    expect(
      (
        await call(retry, await asUser(other.users.admin, "POST", `/api/mail/outbox/${row.id}/retry`), {
          id: String(row.id),
        })
      ).status,
    ).toBe(404);
    const retried = await call(retry, await asUser(s.users.admin, "POST", `/api/mail/outbox/${row.id}/retry`), {
      id: String(row.id),
    });
    expect(retried.status).toBe(200);
    await deliverPendingMail({ only: [row.id] });
    for (let i = 0; i < 40 && !row.sentAt; i++) {
      await sleep(250); // the app's own worker may have claimed it first
      await row.reload();
    }
    expect(row.sentAt).not.toBeNull();
    const box = await listMailFiles(s.shop.id);
    expect(box!.map((f) => f.subject)).toContain("Test digest");
    expect((await listMailFiles(other.shop.id))!.map((f) => f.subject)).not.toContain("Test digest");
  });
});
