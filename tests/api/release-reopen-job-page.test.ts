// The lead reopens a released job from its desk page with the same action and the same rule as
// the release page; reopening queues the customer's "record voided" mail once, in the reopen's
// transaction; and every screen and the record show the signer's registered name, the typed
// e-signature staying in the audit event.
import { describe, expect, it } from "vitest";
import { GET as jobDetail } from "@/app/api/jobs/[jobId]/route";
import { GET as releaseView, POST as sign } from "@/app/api/release/[jobId]/route";
import { POST as reopen } from "@/app/api/release/[jobId]/reopen/route";
import { canReopen } from "@/lib/domain";
import type { JobDetail } from "@/lib/schemas/job";
import { releaseMailKey } from "@/lib/server/mail/outbox";
import { AuditEvent, Job, MailOutbox } from "@/models";
import { createShop, TEST_PASSWORD, type TestShop, type TestUser } from "../support/factories";
import { asUser, call } from "../support/requests";
import { completeJob } from "./release-fixtures";
import { asOwner } from "../support/owner-db";

const params = (s: TestShop) => ({ jobId: String(s.job.id) });
const REASON = "Rod bearing clearance to be checked again with new shells";

async function signAs(s: TestShop, fullName = s.users.inspector.name) {
  const res = await call(
    sign,
    await asUser(s.users.inspector, "POST", `/api/release/${s.job.id}`, { fullName, password: TEST_PASSWORD }),
    params(s),
  );
  expect(res.status).toBe(201);
  return res.body.release as { id: number; hash: string; inspectorName: string };
}

const detail = async (s: TestShop, who: TestUser = s.users.lead) =>
  (await call(jobDetail, await asUser(who, "GET", `/api/jobs/${s.job.id}`), params(s))).body as JobDetail;
const reopenAs = async (s: TestShop, who: TestUser, reason = REASON) =>
  call(reopen, await asUser(who, "POST", `/api/release/${s.job.id}/reopen`, { reason }), params(s));
const voidMails = (s: TestShop) =>
  MailOutbox.findAll({ where: { shopId: s.shop.id, kind: "record_voided" }, order: [["id", "ASC"]] });

describe("reopen from the job page", () => {
  it("the job page offers the lead the same reopen as the release page, and the job unlocks", async () => {
    const s = await createShop();
    await completeJob(s);
    await signAs(s);
    const before = await detail(s);
    expect(before.job).toMatchObject({ status: "released", locked: true, hasStandingRelease: true });
    expect(canReopen("lead", before.job)).toBe(true);
    expect(canReopen("admin", await detail(s, s.users.admin).then((d) => d.job))).toBe(false);
    const view = await call(releaseView, await asUser(s.users.lead, "GET", `/api/release/${s.job.id}`), params(s));
    expect(view.body.can.reopen).toBe(true); // the release page answers from the same rule

    const res = await reopenAs(s, s.users.lead);
    expect(res.status).toBe(200);
    const after = await detail(s);
    expect(after.job).toMatchObject({ status: "review", locked: false, hasStandingRelease: false });
    expect(canReopen("lead", after.job)).toBe(false);
    const again = await reopenAs(s, s.users.lead);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toBe(
      `Job ${s.job.code} is not released (it is review), so there is nothing to reopen.`,
    );
  });

  it.each(["inspector", "machinist", "admin"] as const)(
    "%s is refused (403) and the job stays released",
    async (role) => {
      const s = await createShop();
      await completeJob(s);
      await signAs(s);
      const res = await reopenAs(s, s.users[role]);
      expect(res.status).toBe(403);
      expect((await Job.findByPk(s.job.id))!.status).toBe("released");
      expect(await voidMails(s)).toHaveLength(0);
    },
  );
});

describe("the customer is told when a record they were sent is voided", () => {
  it("queues one 'record voided' mail in the reopen, to the address the record went to", async () => {
    const s = await createShop();
    await completeJob(s);
    const release = await signAs(s);
    const record = await MailOutbox.findOne({ where: { dedupeKey: releaseMailKey(release.id) } });
    expect(record).not.toBeNull();

    expect((await reopenAs(s, s.users.lead)).status).toBe(200);
    expect((await reopenAs(s, s.users.lead)).status).toBe(409); // a second reopen queues nothing
    const mails = await voidMails(s);
    expect(mails).toHaveLength(1);
    expect(mails[0].toAddress).toBe(record!.toAddress);
    expect(mails[0].subject).toBe(`VOID: build record ${s.job.code}, Test job ${s.job.code.slice(2)}`);
    const text = String((mails[0].payload as { text: string }).text);
    expect(text).toContain("is VOID as of");
    expect(text).toContain(`Reason: ${REASON}`);
    expect(text).toContain("When the job is released again, a new build record follows by e-mail");
    expect(text).toContain(release.hash);
    expect(text).toContain(`released by ${s.users.inspector.name}`);
    const audit = await AuditEvent.findOne({ where: { action: "release.void", entityId: String(release.id) } });
    expect((audit!.after as Record<string, unknown>).customerNotified).toBe(true);

    // Released and reopened again: one notice for the second record too, none more for the first.
    await signAs(s);
    expect((await reopenAs(s, s.users.lead)).status).toBe(200);
    expect(await voidMails(s)).toHaveLength(2);
  });

  it("queues nothing when the customer was never sent the record (no e-mail address)", async () => {
    const s = await createShop();
    const job = await Job.findByPk(s.job.id);
    await asOwner("UPDATE customers SET email = NULL WHERE id = ?", [job!.customerId]);
    await completeJob(s);
    const release = await signAs(s);
    expect((await reopenAs(s, s.users.lead)).status).toBe(200);
    expect(await voidMails(s)).toHaveLength(0);
    const audit = await AuditEvent.findOne({ where: { action: "release.void", entityId: String(release.id) } });
    expect((audit!.after as Record<string, unknown>).customerNotified).toBe(false);
  });
});

describe("the signature shows the registered name", () => {
  it("prints the account's name while the typed e-signature stays in the audit event", async () => {
    const s = await createShop();
    await completeJob(s);
    const typed = `  ${s.users.inspector.name.toUpperCase().replace(" ", "   ")}  `;
    const release = await signAs(s, typed);
    expect(release.inspectorName).toBe(s.users.inspector.name);
    expect(release).not.toHaveProperty("signedName");
    const view = await call(releaseView, await asUser(s.users.lead, "GET", `/api/release/${s.job.id}`), params(s));
    expect(view.body.releases[0].inspectorName).toBe(s.users.inspector.name);
    const audit = await AuditEvent.findOne({ where: { action: "release.sign", entityId: String(release.id) } });
    expect((audit!.after as Record<string, unknown>).typedSignature).toBe(typed.trim().replace(/\s+/g, " "));
  });
});
