// GET /api/sync?since=CURSOR&jobs=…: two tablets converge; the cursor never skips a late commit.
import { beforeAll, describe, expect, it } from "vitest";
import { getSequelize } from "@/lib/server/core/db";
import { recordChange } from "@/lib/server/sync/repo";
import { Flag, FlagDisposition, Job } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { later, pull, push, reading } from "./sync-fixtures";
import { asOwner } from "../support/owner-db";

let s: TestShop;
let other: TestShop;
beforeAll(async () => {
  s = await createShop();
  other = await createShop();
});

/** Makes every change row of the job older than the settle window, as if 20 s had passed. */
async function settle(jobId: number) {
  await asOwner("UPDATE sync_changes SET created_at = created_at - INTERVAL 20 SECOND WHERE job_id = ?", [jobId]);
}

type Feed = { cursor: string; readings: { id: string }[]; flags: { id: number }[]; jobs: { id: number }[] };
/** A tablet's local copy: upsert by id, as the client does. */
function apply(store: Map<string, unknown>, feed: Feed) {
  for (const r of feed.readings) store.set(r.id, r);
}

describe("GET /api/sync", () => {
  it("refuses signed-out (401), other roles (403) and a bad query (422, saying what to send)", async () => {
    expect((await pull(null, `jobs=${s.job.id}`)).status).toBe(401);
    expect((await pull(s.users.inspector, `jobs=${s.job.id}`)).status).toBe(403);
    const noJobs = await pull(s.users.machinist, "since=0");
    expect(noJobs.status).toBe(422);
    expect(noJobs.body.error.fields.jobs[0]).toMatch(/job ids/);
    expect((await pull(s.users.machinist, `since=abc&jobs=${s.job.id}`)).body.error.fields.since).toBeDefined();
  });

  it("two devices converge; the cursor only moves over settled changes, so nothing is skipped", async () => {
    const tabA = new Map<string, unknown>();
    const tabB = new Map<string, unknown>();
    const fromA = [reading(s.job.id, "bore/1/top/A", 4.0301), reading(s.job.id, "bore/1/top/B", 4.0302)];
    expect((await push(s.users.machinist, fromA, "tab-A")).status).toBe(200);
    for (const r of fromA) tabA.set(r.id, r);

    const fresh = await pull(s.users.lead, `since=0&jobs=${s.job.id}`);
    expect(fresh.status).toBe(200);
    expect(fresh.body.readings.map((r: { id: string }) => r.id).sort()).toEqual(fromA.map((r) => r.id).sort());
    expect(fresh.body.readings[0]).toMatchObject({ jobId: s.job.id, deviceId: "tab-A", verdict: "in_spec" });
    expect(fresh.body.cursor).toBe("0"); // all rows younger than the settle window: sent, but not passed
    apply(tabB, fresh.body);

    await settle(s.job.id);
    const settled = await pull(s.users.lead, `since=0&jobs=${s.job.id}`);
    expect(Number(settled.body.cursor)).toBeGreaterThan(0);
    const cursorB = settled.body.cursor;

    const fromB = [reading(s.job.id, "bore/2/top/A", 4.0299, { takenAt: later(3) })];
    await push(s.users.lead, fromB, "tab-B");
    for (const r of fromB) tabB.set(r.id, r);
    const toA = await pull(s.users.machinist, `since=${cursorB}&jobs=${s.job.id}`);
    expect(toA.body.readings.map((r: { id: string }) => r.id)).toEqual([fromB[0].id]);
    apply(tabA, toA.body);
    expect([...tabA.keys()].sort()).toEqual([...tabB.keys()].sort());
  });

  it("a change committed after a later-numbered one is still delivered (the cursor waits for it)", async () => {
    const sequelize = getSequelize();
    const [r1, r2] = [reading(s.job.id, "deck/left/front", 9.025), reading(s.job.id, "deck/left/rear", 9.026)];
    await push(s.users.machinist, [r1, r2]);
    await settle(s.job.id);
    const start = (await pull(s.users.machinist, `since=0&jobs=${s.job.id}`)).body.cursor;
    const slow = await sequelize.transaction(); // takes its id first, commits last
    await recordChange(slow, { shopId: s.shop.id, jobId: s.job.id, entity: "reading", entityId: r1.id });
    await sequelize.transaction((t) =>
      recordChange(t, { shopId: s.shop.id, jobId: s.job.id, entity: "reading", entityId: r2.id }),
    );
    const [{ hi }] = await sequelize.query<{ hi: number }>("SELECT MAX(id) AS hi FROM sync_changes WHERE job_id = ?", {
      replacements: [s.job.id],
      type: "SELECT" as never,
    });

    const mid = await pull(s.users.machinist, `since=${start}&jobs=${s.job.id}`);
    expect(mid.body.readings.map((r: { id: string }) => r.id)).toEqual([r2.id]);
    expect(mid.body.cursor).toBe(start); // r2's row is fresh, so the cursor does not pass it
    await slow.commit();

    const next = await pull(s.users.machinist, `since=${mid.body.cursor}&jobs=${s.job.id}`);
    expect(next.body.readings.map((r: { id: string }) => r.id).sort()).toEqual([r1.id, r2.id].sort());
    // What a naive "highest id seen" cursor would have lost:
    const naive = await pull(s.users.machinist, `since=${hi}&jobs=${s.job.id}`);
    expect(naive.body.readings).toEqual([]);
  });

  it("sends flags with their latest disposition, new limits, and the job's lock", async () => {
    await push(s.users.machinist, [reading(s.job.id, "bore/3/top/A", 4.0312)]);
    await settle(s.job.id);
    const cursor = (await pull(s.users.machinist, `since=0&jobs=${s.job.id}`)).body.cursor;
    const sequelize = getSequelize();
    const flag = await Flag.findOne({ where: { jobId: s.job.id, stationId: "bore/3/top/A" } });
    // The limit change as the owner, just before: the app itself replaces limits, it never updates one.
    await asOwner("UPDATE job_limits SET tol_plus = 0.001 WHERE job_id = ? AND characteristic = 'bore_diameter'", [
      s.job.id,
    ]);
    await sequelize.transaction(async (t) => {
      await flag!.update(
        { state: "disposed", disposition: "measure_again", disposedBy: s.users.lead.id, disposedAt: new Date() },
        { transaction: t },
      );
      await FlagDisposition.create(
        { flagId: flag!.id, disposition: "measure_again", userId: s.users.lead.id },
        { transaction: t },
      );
      await recordChange(t, { shopId: s.shop.id, jobId: s.job.id, entity: "flag", entityId: flag!.id });
      await Job.update(
        { specRevision: 2, status: "released", lockedAt: new Date("2026-12-20T10:00:00Z") },
        { where: { id: s.job.id }, transaction: t },
      );
      await recordChange(t, { shopId: s.shop.id, jobId: s.job.id, entity: "job_limits", entityId: s.job.id });
      await recordChange(t, { shopId: s.shop.id, jobId: s.job.id, entity: "job", entityId: s.job.id });
    });
    const feed = await pull(s.users.machinist, `since=${cursor}&jobs=${s.job.id},${other.job.id},999999999`);
    expect(feed.body.flags).toMatchObject([
      { id: flag!.id, state: "disposed", disposition: "measure_again", revisit: true, stations: ["bore/3/top/A"] },
    ]);
    expect(feed.body.limits).toHaveLength(1);
    expect(feed.body.limits[0].specRevision).toBe(2);
    expect(
      feed.body.limits[0].spec.find((l: { characteristic: string }) => l.characteristic === "bore_diameter").tolPlus,
    ).toBe(0.001);
    expect(feed.body.jobs).toMatchObject([{ id: s.job.id, status: "released", locked: true, specRevision: 2 }]);
    expect(feed.body.jobs[0].lockReason).toMatch(/was released on 20 Dec 2026/);
    expect(feed.body.missing.sort()).toEqual([other.job.id, 999999999].sort());
    expect(JSON.stringify(feed.body)).not.toContain(other.job.code);
  });
});
