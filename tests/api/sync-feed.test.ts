// GET /api/sync?since=CURSOR&jobs=…: two tablets converge; the cursor never skips a late commit nor repeats one.
import { beforeAll, describe, expect, it } from "vitest";
import { getSequelize } from "@/lib/server/core/db";
import { QueryTypes } from "sequelize";
import { CHANGE_PAGE, recordChange, recordChanges } from "@/lib/server/sync/repo";
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

  it("two devices converge; the cursor is the last change sent, so nothing is sent twice", async () => {
    const tabA = new Map<string, unknown>();
    const tabB = new Map<string, unknown>();
    const fromA = [reading(s.job.id, "bore/1/top/A", 4.0301), reading(s.job.id, "bore/1/top/B", 4.0302)];
    expect((await push(s.users.machinist, fromA, "tab-A")).status).toBe(200);
    for (const r of fromA) tabA.set(r.id, r);

    const fresh = await pull(s.users.lead, `since=0&jobs=${s.job.id}`);
    expect(fresh.status).toBe(200);
    expect(fresh.body.readings.map((r: { id: string }) => r.id).sort()).toEqual(fromA.map((r) => r.id).sort());
    expect(fresh.body.readings[0]).toMatchObject({ jobId: s.job.id, deviceId: "tab-A", verdict: "in_spec" });
    expect(Number(fresh.body.cursor)).toBeGreaterThan(0);
    apply(tabB, fresh.body);
    const cursorB = fresh.body.cursor;
    expect((await pull(s.users.lead, `since=${cursorB}&jobs=${s.job.id}`)).body.readings).toEqual([]);

    const fromB = [reading(s.job.id, "bore/2/top/A", 4.0299, { takenAt: later(3) })];
    await push(s.users.lead, fromB, "tab-B");
    for (const r of fromB) tabB.set(r.id, r);
    const toA = await pull(s.users.machinist, `since=${cursorB}&jobs=${s.job.id}`);
    expect(toA.body.readings.map((r: { id: string }) => r.id)).toEqual([fromB[0].id]);
    apply(tabA, toA.body);
    expect([...tabA.keys()].sort()).toEqual([...tabB.keys()].sort());
  });

  it("numbers changes in commit order: a later writer waits, and the feed never shows it before the earlier", async () => {
    const sequelize = getSequelize();
    const [r1, r2] = [reading(s.job.id, "deck/left/front", 9.025), reading(s.job.id, "deck/left/rear", 9.026)];
    await push(s.users.machinist, [r1, r2]);
    const start = (await pull(s.users.machinist, `since=0&jobs=${s.job.id}`)).body.cursor;
    const slow = await sequelize.transaction(); // numbers its change first, commits last
    await recordChange(slow, { shopId: s.shop.id, jobId: s.job.id, entity: "reading", entityId: r1.id });
    let fastDone = false;
    const fast = sequelize
      .transaction((t) => recordChange(t, { shopId: s.shop.id, jobId: s.job.id, entity: "reading", entityId: r2.id }))
      .then(() => (fastDone = true));
    await new Promise((r) => setTimeout(r, 300));
    expect(fastDone).toBe(false); // held on the shop's sequence until the earlier number commits

    const mid = await pull(s.users.machinist, `since=${start}&jobs=${s.job.id}`);
    expect(mid.body.readings).toEqual([]);
    expect(mid.body.cursor).toBe(start);
    await slow.commit();
    await fast;

    const next = await pull(s.users.machinist, `since=${mid.body.cursor}&jobs=${s.job.id}`);
    expect(next.body.readings.map((r: { id: string }) => r.id).sort()).toEqual([r1.id, r2.id].sort());
    expect(Number(next.body.cursor)).toBe(Number(start) + 2);
    const rows = await sequelize.query<{ entityId: string; seq: number }>(
      "SELECT entity_id AS entityId, seq FROM sync_changes WHERE shop_id = ? AND seq > ? ORDER BY seq",
      { replacements: [s.shop.id, start], type: QueryTypes.SELECT },
    );
    expect(rows.map((r) => r.entityId)).toEqual([r1.id, r2.id]); // commit order, whatever the ids
    expect((await pull(s.users.machinist, `since=${next.body.cursor}&jobs=${s.job.id}`)).body.readings).toEqual([]);
  });

  it("pages through more changes than one reply holds, each change once", async () => {
    const start = (await pull(s.users.machinist, `since=0&jobs=${other.job.id}`)).body.cursor;
    const many = Array.from({ length: CHANGE_PAGE + 5 }, (_, i) => ({
      shopId: other.shop.id,
      jobId: other.job.id,
      entity: "job" as const,
      entityId: String(i),
    }));
    await getSequelize().transaction((t) => recordChanges(t, many));
    const first = await pull(other.users.machinist, `since=${start}&jobs=${other.job.id}`);
    expect(first.body.more).toBe(true);
    const second = await pull(other.users.machinist, `since=${first.body.cursor}&jobs=${other.job.id}`);
    expect(second.body.more).toBe(false);
    expect(Number(second.body.cursor) - Number(start)).toBe(CHANGE_PAGE + 5);
  });

  it("sends flags with their latest disposition, new limits, and the job's lock", async () => {
    await push(s.users.machinist, [reading(s.job.id, "bore/3/top/A", 4.0312)]);
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
