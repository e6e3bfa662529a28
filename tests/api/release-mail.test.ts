// Release → mail in a straight line: signing queues the customer's build-record mail in the sign
// transaction (in the admin's mail view at once, with no notifier running), a failed signature
// queues nothing, and the notifier's safety net finds the release already mailed, by the same key.
import { QueryTypes } from "sequelize";
import { describe, expect, it, vi } from "vitest";
import { GET as outbox } from "@/app/api/mail/outbox/route";
import { POST as sign } from "@/app/api/release/[jobId]/route";
import { getSequelize } from "@/lib/server/core/db";
import { notifierRunning, runNotifierOnce } from "@/lib/server/notify/notifier";
import { releasesWithoutMail } from "@/lib/server/notify/repo";
import { releaseMailKey, releaseMailKeySql } from "@/lib/server/mail/outbox";
import { recordChange } from "@/lib/server/sync/repo";
import { Job, MailOutbox, Release } from "@/models";
import { createShop, TEST_PASSWORD, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";
import { completeJob } from "./release-fixtures";
import { asOwner } from "../support/owner-db";

// recordChange runs after the mail is queued in the sign transaction; one test makes it fail.
vi.mock("@/lib/server/sync/repo", async (importOriginal) => {
  const real = await importOriginal<typeof import("@/lib/server/sync/repo")>();
  return { ...real, recordChange: vi.fn(real.recordChange) };
});

const signJob = async (s: TestShop) =>
  call(
    sign,
    await asUser(s.users.inspector, "POST", `/api/release/${s.job.id}`, {
      fullName: s.users.inspector.name,
      password: TEST_PASSWORD,
    }),
    { jobId: String(s.job.id) },
  );

type Listed = { id: number; kind: string; toAddress: string; subject: string; sentAt: string | null };

describe("signing queues the build record", () => {
  it("puts the customer's mail in the outbox in the sign transaction, seen in the mail view at once", async () => {
    expect(notifierRunning()).toBe(false); // nothing but the signature can queue it here
    const s = await createShop();
    await completeJob(s);
    const res = await signJob(s);
    expect(res.status).toBe(201);
    const releaseId = res.body.release.id as number;
    const view = await call(outbox, await asUser(s.users.admin, "GET", "/api/mail/outbox"), {});
    expect(view.status).toBe(200);
    const records = (view.body.messages as Listed[]).filter((m) => m.kind === "build_record");
    expect(records).toHaveLength(1);
    expect(records[0].toAddress).toBe(`customer-${s.job.code.slice(2)}@test.example`);
    expect(records[0].subject).toBe(`Build record ${s.job.code}: Test job ${s.job.code.slice(2)}`);
    expect(records[0].sentAt).toBeNull();
    const row = await MailOutbox.findByPk(records[0].id);
    expect(row!.dedupeKey).toBe(releaseMailKey(releaseId));
    expect(row!.payload).toEqual({ jobId: s.job.id, releaseId });
  });

  it("queues nothing when the signature's transaction fails after the mail was written", async () => {
    const s = await createShop();
    await completeJob(s);
    vi.mocked(recordChange).mockRejectedValueOnce(new Error("the change feed could not be written"));
    const res = await signJob(s);
    expect(res.status).toBe(500);
    expect(vi.mocked(recordChange)).toHaveBeenCalled();
    expect(await Release.count({ where: { jobId: s.job.id } })).toBe(0);
    expect(await MailOutbox.count({ where: { shopId: s.shop.id } })).toBe(0);
    expect((await Job.findByPk(s.job.id))!.status).toBe("measuring");
  });
});

describe("the notifier's safety net", () => {
  it("builds the same key in SQL as releaseMailKey", async () => {
    const sequelize = getSequelize();
    const sql = releaseMailKeySql("ids.id", (text) => sequelize.escape(text));
    const rows = await sequelize.query<{ id: number; k: string }>(
      `SELECT ids.id, ${sql} AS k FROM (SELECT 7 AS id UNION ALL SELECT 123456789) ids ORDER BY ids.id`,
      { type: QueryTypes.SELECT },
    );
    expect(rows.map((r) => r.k)).toEqual([releaseMailKey(7), releaseMailKey(123456789)]);
  });

  it("sees a signed release as mailed and queues no second message; a release without mail it finds", async () => {
    const s = await createShop();
    await completeJob(s);
    const since = new Date(Date.now() - 60_000);
    const res = await signJob(s);
    expect(res.status).toBe(201);
    const releaseId = res.body.release.id as number;
    expect((await releasesWithoutMail(since)).map((r) => r.id)).not.toContain(releaseId);
    const report = await runNotifierOnce();
    expect(report.errors).toEqual([]);
    expect(await MailOutbox.count({ where: { shopId: s.shop.id, kind: "build_record" } })).toBe(1);
    // With its mail gone, the same release is found (the one query's key matches the queued one).
    await asOwner("DELETE FROM mail_outbox WHERE shop_id = ?", [s.shop.id]); // the app never deletes mail
    expect((await releasesWithoutMail(since)).map((r) => r.id)).toContain(releaseId);
  }, 180_000);
});
