// The tablet's sync engine (lib/offline) against the real POST/GET /api/sync handlers and MariaDB:
// the refused, held, 409 and 413 answers as the server really gives them, not as a fake imagines
// them. Dexie runs on fake-indexeddb; readings are entered the way the bench screen stores them.
import "fake-indexeddb/auto";
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { BenchDb } from "@/lib/offline/db";
import { getSyncStatus, setMeta } from "@/lib/offline/meta";
import { savePack } from "@/lib/offline/packs";
import { recordReading, resendReading } from "@/lib/offline/readings";
import { SyncEngine } from "@/lib/offline/sync-engine";
import { getJson } from "@/lib/offline/transport";
import { MAX_BATCH, type JobPack } from "@/lib/schemas/sync";
import { getSequelize } from "@/lib/server/core/db";
import { Job, JobLimit } from "@/models";
import { createShop, INCH_LIMITS, type TestShop, gaugeFor } from "../support/factories";
import { handlerFetch } from "../support/handler-fetch";

const BASE = "http://localhost";
let shop: TestShop;
beforeAll(async () => {
  shop = await createShop();
});

/** Another open job of the shop, on the same engine, with its own copy of the limits. */
async function anotherJob(s: TestShop): Promise<number> {
  getSequelize();
  const tag = randomUUID().slice(0, 8);
  const job = await Job.create({
    shopId: s.shop.id,
    customerId: s.customer.id,
    engineId: s.engine.id,
    templateId: s.template.id,
    code: `T2-${tag}`,
    title: `Second job ${tag}`,
    unitSystem: "in",
    status: "measuring",
  });
  for (const [i, l] of INCH_LIMITS.entries()) await JobLimit.create({ ...l, jobId: job.id, sortOrder: i });
  return job.id;
}

/** A tablet signed in as the shop's machinist, holding the packs the real server hands out. */
async function tablet(jobIds: number[]) {
  const user = shop.users.machinist;
  const server = handlerFetch(user);
  const db = new BenchDb(`engine-server-${randomUUID()}`);
  await setMeta(db, "actor", {
    userId: user.id,
    shopId: user.shopId,
    name: user.name,
    email: user.email,
    role: "machinist",
  });
  for (const id of jobIds) await savePack(db, await getJson<JobPack>(server.fetch, `${BASE}/api/bench/jobs/${id}`));
  const ctx = { deviceId: "tab-engine-test", takenBy: user.id };
  const gauge = (stationId: string) => gaugeFor(user.shopId, stationId);
  const enter = async (jobId: number, values: [string, number][]) => {
    const out = [];
    for (const [stationId, value] of values)
      out.push(await recordReading(db, { jobId, stationId, value, unit: "in", instrumentId: gauge(stationId) }, ctx));
    return out;
  };
  const engine = (batchSize?: number) =>
    new SyncEngine({ db, fetch: server.fetch, baseUrl: BASE, random: () => 0.5, ...(batchSize ? { batchSize } : {}) });
  return { db, server, enter, engine };
}

async function storedIds(jobId: number): Promise<string[]> {
  const rows = await getSequelize().query<{ id: string }>("SELECT id FROM readings WHERE job_id = ? ORDER BY id", {
    replacements: [jobId],
    type: "SELECT" as never,
  });
  return rows.map((r) => r.id);
}

const sorted = (ids: string[]) => [...ids].sort();

describe("sync engine against the real handler", () => {
  it("422: one refused reading holds the rest; the held go again, the refused keeps the server's words", async () => {
    const { db, server, enter, engine } = await tablet([shop.job.id]);
    const good = await enter(shop.job.id, [
      ["bore/1/top/A", 4.0302],
      ["bore/1/top/B", 4.0301],
      ["bore/1/bottom/A", 4.0299],
    ]);
    // The tablet stores any number; only the server's plausibility check catches a slipped decimal point.
    const [slip] = await enter(shop.job.id, [["bore/1/mid/A", 40.302]]);
    await engine().sync("manual");

    expect(server.pushes().map((e) => [e.status, e.sent])).toEqual([
      [422, 4], // nothing written: one refused, three held
      [200, 3], // the held three, without the refused one
    ]);
    const refused = await db.readings.get(slip.id);
    expect(refused?.state).toBe("rejected");
    expect(refused?.rejection?.code).toBe("invalid");
    expect(refused?.rejection?.errors?.value?.[0]).toMatch(/^40\.302 in cannot be a .*Check the decimal point/);
    for (const r of good) expect((await db.readings.get(r.id))?.state).toBe("synced");
    expect(await db.outbox.count()).toBe(0);
    expect(await storedIds(shop.job.id)).toEqual(sorted(good.map((r) => r.id)));
    expect(await getSyncStatus(db)).toMatchObject({ needsAction: false, failures: 0, lastError: undefined });

    // The machinist fixes the figure; the same reading (same id) goes through.
    await resendReading(db, slip.id, { value: 4.0302 });
    await engine().sync("manual");
    expect(server.pushes().at(-1)).toMatchObject({ status: 200, sent: 1 });
    expect((await db.readings.get(slip.id))?.state).toBe("synced");
    expect(await storedIds(shop.job.id)).toEqual(sorted([...good, slip].map((r) => r.id)));
  });

  it("409: a job released behind the tablet's back refuses its readings as locked; the others go through", async () => {
    const other = await anotherJob(shop);
    const { db, server, enter, engine } = await tablet([shop.job.id, other]);
    const open = await enter(shop.job.id, [
      ["bore/2/top/A", 4.0301],
      ["bore/2/top/B", 4.0302],
    ]);
    const late = await enter(other, [
      ["bore/1/top/A", 4.0301],
      ["bore/1/top/B", 4.03],
    ]);
    await Job.update({ status: "released", lockedAt: new Date() }, { where: { id: other } });
    await engine().sync("manual");

    expect(server.pushes().map((e) => [e.status, e.sent])).toEqual([
      [409, 4],
      [200, 2],
    ]);
    for (const r of late) {
      const local = await db.readings.get(r.id);
      expect(local?.state).toBe("rejected");
      expect(local?.rejection).toMatchObject({ code: "job_locked" });
      expect(local?.rejection?.reason).toMatch(/readings are locked/);
    }
    for (const r of open) expect((await db.readings.get(r.id))?.state).toBe("synced");
    expect(await storedIds(other)).toEqual([]);
    // The pull that follows tells the tablet the job is locked now.
    expect((await db.jobs.get(other))?.pack.job.locked).toBe(true);
    expect(await db.outbox.count()).toBe(0);
  });

  it("a batch over the server's limit (413) is split in halves and every reading arrives once", async () => {
    const fresh = await anotherJob(shop);
    const { db, server, enter, engine } = await tablet([fresh]);
    const stations = [1, 2, 3, 4, 5, 6, 7, 8].flatMap((c) =>
      ["top", "mid", "bottom"].flatMap((level) => ["A", "B"].map((axis) => `bore/${c}/${level}/${axis}`)),
    );
    // More readings than MAX_BATCH: each station measured several times, as after re-honing.
    const count = MAX_BATCH + 10;
    const values = Array.from({ length: count }, (_, i): [string, number] => [
      stations[i % stations.length],
      4.0298 + (i % 5) * 0.0001,
    ]);
    const sent = await enter(fresh, values);
    // A tablet configured with batches larger than the server takes (production sends 100).
    await engine(MAX_BATCH + 100).sync("manual");

    const pushes = server.pushes();
    expect(pushes[0]).toMatchObject({ status: 413, sent: count });
    expect(pushes.slice(1).every((e) => e.status === 200 && e.sent! <= MAX_BATCH)).toBe(true);
    expect(pushes.slice(1).reduce((n, e) => n + e.sent!, 0)).toBe(count);
    expect((await storedIds(fresh)).length).toBe(count);
    expect(await storedIds(fresh)).toEqual(sorted(sent.map((r) => r.id)));
    expect(await db.readings.where("state").equals("synced").count()).toBe(count);
    expect(await getSyncStatus(db)).toMatchObject({ needsAction: false, lastError: undefined });
  });
});
