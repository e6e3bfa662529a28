import "fake-indexeddb/auto";
import { describe, expect, it } from "vitest";
import { MAX_BATCH } from "@/lib/schemas/sync";
import { BATCH_SIZE, applyPushResults, nextBatch } from "@/lib/offline/outbox";
import { recordReading, resendReading } from "@/lib/offline/readings";
import { ensureDeviceId, getMeta } from "@/lib/offline/meta";
import { savePack, applyFeed } from "@/lib/offline/packs";
import { makePack } from "./fake-server";
import { CTX, bore, enter, freshDb } from "./helpers";

describe("local store", () => {
  it("writes a reading and its outbox row together, pending", async () => {
    const db = await freshDb();
    const r = await recordReading(db, bore("bore/1/top/A", 4.0302), CTX);
    expect(r.id).toMatch(/^[0-9a-f-]{36}$/);
    expect((await db.readings.get(r.id))?.state).toBe("pending");
    expect(await db.outbox.get(r.id)).toMatchObject({ readingId: r.id, jobId: 1, takenBy: 7, attempts: 0 });
  });

  it("refuses a value that is not a number and a skip without a reason, saying what to fix", async () => {
    const db = await freshDb();
    await expect(recordReading(db, bore("bore/1/top/A", Number.NaN), CTX)).rejects.toThrow(/as a number/);
    await expect(
      recordReading(db, { ...bore("bore/1/top/A", 0), value: null, skipped: true, skipReason: "  " }, CTX),
    ).rejects.toThrow(/why/);
    expect(await db.readings.count()).toBe(0);
  });

  it("keeps a device id once made", async () => {
    const db = await freshDb();
    const a = await ensureDeviceId(db);
    expect(a).toMatch(/^tab-/);
    expect(await ensureDeviceId(db)).toBe(a);
  });

  it("batches only the signed-in person's readings, oldest first, within the contract's limit", async () => {
    expect(BATCH_SIZE).toBeLessThanOrEqual(MAX_BATCH);
    const db = await freshDb();
    const [first] = await enter(db, [
      ["bore/1/top/A", 4.0301],
      ["bore/1/top/B", 4.0302],
    ]);
    await recordReading(db, bore("bore/2/top/A", 4.03), { ...CTX, takenBy: 99 });
    const batch = await nextBatch(db, 7);
    expect(batch.payload.map((p) => p.stationId)).toEqual(["bore/1/top/A", "bore/1/top/B"]);
    expect(batch.payload[0]).toEqual({
      id: first.id,
      jobId: 1,
      stationId: "bore/1/top/A",
      unit: "in",
      entryMode: "direct",
      takenAt: first.takenAt,
      value: 4.0301,
    });
  });

  it("an accepted reading becomes synced with the server's verdict; a rejected one stays, marked, out of the outbox", async () => {
    const db = await freshDb();
    const [a, b, c] = await enter(db, [
      ["bore/1/top/A", 4.0302],
      ["bore/1/top/B", 4.0302],
      ["bore/1/mid/A", 4.0302],
    ]);
    const evaluation = {
      verdict: "in_spec" as const,
      verdictNote: null,
      unit: "in",
      limitMin: 4.0295,
      limitMax: 4.0305,
      deviation: 0.0002,
    };
    const outcome = await applyPushResults(
      db,
      [a, b, c],
      [
        { index: 0, id: a.id, status: "accepted", replay: false, verdict: "in_spec", evaluation },
        { index: 1, id: b.id, status: "rejected", code: "job_locked", reason: "Job is released" },
        { index: 2, id: c.id, status: "held" },
      ],
    );
    expect(outcome).toEqual({ accepted: 1, rejected: 1, held: 1 });
    expect(await db.readings.get(a.id)).toMatchObject({ state: "synced", verdict: "in_spec", deviation: 0.0002 });
    expect(await db.readings.get(b.id)).toMatchObject({
      state: "rejected",
      rejection: { code: "job_locked", reason: "Job is released" },
    });
    expect((await db.outbox.toArray()).map((o) => [o.readingId, o.attempts])).toEqual([[c.id, 1]]);
    await resendReading(db, b.id, { value: 4.0301 });
    expect(await db.readings.get(b.id)).toMatchObject({ state: "pending", value: 4.0301, rejection: undefined });
    expect(await db.outbox.get(b.id)).toBeTruthy();
    await expect(resendReading(db, a.id, { value: 1 })).rejects.toThrow(/Only a reading the server refused/);
  });

  it("a pack never moves the cursor forward; the feed moves it and folds in other tablets' readings and flags", async () => {
    const db = await freshDb();
    await applyFeed(db, { cursor: "40", more: false, jobs: [], limits: [], readings: [], flags: [], missing: [] });
    await savePack(db, { ...makePack(2), cursor: "12" });
    expect(await getMeta(db, "cursor")).toBe("12");
    await savePack(db, { ...makePack(3), cursor: "90" });
    expect(await getMeta(db, "cursor")).toBe("12");
    const [mine] = await enter(db, [["bore/1/top/A", 4.0302]]);
    const flag = {
      id: 5,
      jobId: 1,
      readingId: null,
      derivedKey: null,
      stationId: "bore/1/top/A",
      characteristic: "bore_diameter",
      value: 4.031,
      unit: "in",
      limitMin: 4.0295,
      limitMax: 4.0305,
      deviation: 0.001,
      verdict: "out_of_spec" as const,
      reason: "out_of_spec" as const,
      state: "disposed" as const,
      disposition: "measure_again" as const,
      operation: null,
      dispositionReason: null,
      disposedAt: "2026-01-01T00:00:00Z",
      closedAt: null,
      createdAt: "2026-01-01T00:00:00Z",
      stations: ["bore/1/top/A"],
      revisit: true,
    };
    const echo = {
      id: mine.id,
      jobId: 1,
      stationId: "bore/1/top/A",
      characteristic: "bore_diameter",
      value: 4.0302,
      unit: "in",
      valueCanonical: 102.36708,
      entryMode: "direct" as const,
      dialSetting: null,
      dialDeviation: null,
      instrumentId: null,
      partTempC: null,
      gaugeTempC: null,
      lubricant: null,
      skipped: false,
      skipReason: null,
      note: null,
      supersedes: null,
      supersededBy: null,
      takenAt: mine.takenAt,
      receivedAt: new Date().toISOString(),
      takenBy: 7,
      deviceId: "tab-test",
      verdict: "in_spec" as const,
      verdictNote: null,
      limitMin: 4.0295,
      limitMax: 4.0305,
      deviation: 0.0002,
    };
    await applyFeed(db, {
      cursor: "41",
      more: false,
      jobs: [{ ...makePack(1).job, status: "review" }],
      limits: [],
      readings: [echo],
      flags: [flag],
      missing: [3],
    });
    expect(await db.readings.get(mine.id)).toMatchObject({ state: "synced", verdict: "in_spec" });
    expect(await db.outbox.count()).toBe(0);
    const job1 = await db.jobs.get(1);
    expect(job1?.pack.job.status).toBe("review");
    expect(job1?.pack.flags.map((f) => f.id)).toEqual([5]);
    expect((await db.jobs.get(3))?.gone).toBe(true);
    expect(await getMeta(db, "cursor")).toBe("41");
    await applyFeed(db, {
      cursor: "42",
      more: false,
      jobs: [],
      limits: [],
      readings: [],
      flags: [{ ...flag, state: "closed" }],
      missing: [],
    });
    expect((await db.jobs.get(1))?.pack.flags).toEqual([]);
  });
});
