import "fake-indexeddb/auto";
import { afterEach, describe, expect, it } from "vitest";
import { BenchDb } from "@/lib/offline/db";
import { getSyncStatus, setMeta } from "@/lib/offline/meta";
import { resendReading } from "@/lib/offline/readings";
import { SyncEngine } from "@/lib/offline/sync-engine";
import { FakeServer } from "./fake-server";
import { enter, freshDb } from "./helpers";

const BASE = "http://tw.test";
const engines: SyncEngine[] = [];
function engineFor(db: BenchDb, server: FakeServer, extra: Partial<ConstructorParameters<typeof SyncEngine>[0]> = {}) {
  const e = new SyncEngine({ db, fetch: server.fetch, baseUrl: BASE, random: () => 0.5, ...extra });
  engines.push(e);
  return e;
}
afterEach(() => engines.splice(0).forEach((e) => e.stop()));

const states = async (db: BenchDb) => (await db.readings.toCollection().sortBy("takenAt")).map((r) => r.state);
const BORES: [string, number][] = [
  ["bore/1/top/A", 4.0302],
  ["bore/1/top/B", 4.0301],
  ["bore/1/mid/A", 4.0303],
  ["bore/1/mid/B", 4.03],
  ["bore/1/bottom/A", 4.0299],
];

describe("sync engine", () => {
  it("sends pending readings, marks them synced with the server's verdict, and records the success", async () => {
    const db = await freshDb();
    const server = new FakeServer();
    await enter(db, [
      ["bore/1/top/A", 4.0302],
      ["bore/1/top/B", 4.0312],
    ]);
    await engineFor(db, server).sync("manual");
    expect(await states(db)).toEqual(["synced", "synced"]);
    expect((await db.readings.toArray()).map((r) => r.verdict).sort()).toEqual(["in_spec", "out_of_spec"]);
    expect(await db.outbox.count()).toBe(0);
    const status = await getSyncStatus(db);
    expect(status).toMatchObject({ running: false, failures: 0 });
    expect(status.lastSuccessAt).toBeTruthy();
    expect(status.lastError).toBeUndefined();
  });

  it("network failure mid-batch: the sent batch is synced, the rest waits, then goes; nothing twice", async () => {
    const db = await freshDb();
    const server = new FakeServer();
    await enter(db, BORES);
    let calls = 0;
    server.before = (url, init) => {
      if (url.pathname === "/api/sync" && init.method === "POST" && ++calls === 2)
        throw new TypeError("Failed to fetch");
    };
    const engine = engineFor(db, server, { batchSize: 2 });
    await engine.sync("manual");
    expect(await states(db)).toEqual(["synced", "synced", "pending", "pending", "pending"]);
    const failed = await getSyncStatus(db);
    expect(failed).toMatchObject({ failures: 1, lastError: "No connection to the server", needsAction: false });
    expect(Date.parse(failed.nextAttemptAt!)).toBeGreaterThan(Date.now());
    await engine.sync("online");
    expect(await states(db)).toEqual(Array(5).fill("synced"));
    expect(server.stored.size).toBe(5);
    expect((await getSyncStatus(db)).failures).toBe(0);
  });

  it("the same batch sent twice (answer lost on the way back) is stored once and ends synced", async () => {
    const db = await freshDb();
    const server = new FakeServer();
    await enter(db, BORES.slice(0, 3));
    server.after = () => {
      server.after = undefined;
      throw new TypeError("connection reset");
    };
    const engine = engineFor(db, server);
    await engine.sync("manual");
    expect(server.stored.size).toBe(3);
    expect(await states(db)).toEqual(["pending", "pending", "pending"]);
    await engine.sync("manual");
    expect(server.pushes).toBe(2);
    expect(server.stored.size).toBe(3);
    expect(await states(db)).toEqual(["synced", "synced", "synced"]);
    expect(await db.readings.count()).toBe(3);
  });

  it("the server rejecting part of a batch: rejected ones stay with the server's words, held ones are resent", async () => {
    const db = await freshDb();
    const server = new FakeServer();
    const { savePack } = await import("@/lib/offline/packs");
    const { makePack } = await import("./fake-server");
    await savePack(db, makePack(2));
    await enter(db, BORES.slice(0, 2));
    const [locked] = await enter(db, [["bore/1/top/A", 4.0302]], { jobId: 2 });
    server.locked.add(2);
    await engineFor(db, server).sync("manual");
    const bad = await db.readings.get(locked.id);
    expect(bad).toMatchObject({
      state: "rejected",
      rejection: { code: "job_locked", reason: "Job 2 is released; readings are locked" },
    });
    expect((await db.readings.where("jobId").equals(1).toArray()).map((r) => r.state)).toEqual(["synced", "synced"]);
    expect(server.stored.has(locked.id)).toBe(false);
    expect(await db.outbox.count()).toBe(0);
    // Unlocked and sent again by the machinist: it goes through.
    server.locked.delete(2);
    await resendReading(db, locked.id, {});
    await engineFor(db, server).sync("manual");
    expect((await db.readings.get(locked.id))?.state).toBe("synced");
  });

  it("a crash between the server's write and the local acknowledge loses nothing and duplicates nothing", async () => {
    const name = `crash-${Date.now()}`;
    const db = await freshDb(name);
    const server = new FakeServer();
    await enter(db, BORES.slice(0, 2));
    server.after = () => db.close(); // the tab dies with the answer in flight
    await engineFor(db, server)
      .sync("manual")
      .catch(() => undefined);
    expect(server.stored.size).toBe(2);
    server.after = undefined;
    const reopened = new BenchDb(name);
    expect(await reopened.outbox.count()).toBe(2);
    await engineFor(reopened, server).sync("start");
    expect(await states(reopened)).toEqual(["synced", "synced"]);
    expect(await reopened.readings.count()).toBe(2);
    expect(server.stored.size).toBe(2);
  });

  it("backs off on 5xx: an entry or the timer waits, the online event and a tap retry at once", async () => {
    const db = await freshDb();
    const server = new FakeServer();
    await enter(db, BORES.slice(0, 1));
    server.status = 502;
    const engine = engineFor(db, server, { backoff: { baseMs: 60_000, maxMs: 600_000 } });
    await engine.sync("manual");
    expect(await getSyncStatus(db)).toMatchObject({
      failures: 1,
      lastError: "The server had a problem (502); trying again shortly",
    });
    await engine.sync("entry");
    await engine.sync("timer");
    expect(server.pushes).toBe(1);
    await engine.sync("manual");
    expect(server.pushes).toBe(2);
    expect((await getSyncStatus(db)).failures).toBe(2);
    server.status = 0;
    await engine.sync("online");
    expect(await states(db)).toEqual(["synced"]);
  });

  it("runs one sync at a time; a trigger during a run gets one more run after it", async () => {
    const db = await freshDb();
    const server = new FakeServer();
    await enter(db, BORES.slice(0, 1));
    let inFlight = 0;
    let most = 0;
    let pulls = 0;
    const engine = engineFor(db, server);
    const during: Promise<void>[] = [];
    server.before = async (_url, init) => {
      if (init.method === "GET") pulls++;
      if (init.method === "POST" && server.pushes === 0) during.push(engine.sync("entry"), engine.sync("online"));
      most = Math.max(most, ++inFlight);
      await new Promise((r) => setTimeout(r, 5));
      inFlight--;
    };
    await Promise.all([engine.sync("manual"), engine.sync("timer")]);
    await Promise.all(during);
    expect(most).toBe(1);
    expect(server.pushes).toBe(1);
    expect(pulls).toBe(2); // the first run, then exactly one more for the triggers that came during it
  });

  it("signed out: says so in words, keeps every reading, does not hammer the server", async () => {
    const db = await freshDb();
    const server = new FakeServer();
    await enter(db, BORES.slice(0, 2));
    server.before = (url) =>
      url.pathname === "/api/sync"
        ? new Response(JSON.stringify({ error: { code: "unauthorized", message: "Sign in first" } }), { status: 401 })
        : undefined;
    await engineFor(db, server).sync("manual");
    expect(await getSyncStatus(db)).toMatchObject({
      needsAction: true,
      lastError: "Signed out: sign in again so the tablet can send its readings",
      failures: 0,
    });
    expect(await states(db)).toEqual(["pending", "pending"]);
    expect(await db.outbox.count()).toBe(2);
  });

  it("pulls other tablets' readings for the jobs it holds, and only those", async () => {
    const db = await freshDb();
    const server = new FakeServer();
    server.addForeign({
      id: "0b6f7f0e-3f4c-4d2a-9a57-6a3e8f1f2a10",
      jobId: 1,
      stationId: "bore/2/top/A",
      value: 4.0304,
      unit: "in",
      takenAt: "2026-01-01T10:00:00Z",
    });
    server.addForeign({
      id: "0b6f7f0e-3f4c-4d2a-9a57-6a3e8f1f2a11",
      jobId: 8,
      stationId: "bore/2/top/A",
      value: 4.0304,
      unit: "in",
      takenAt: "2026-01-01T10:00:00Z",
    });
    await engineFor(db, server).sync("start");
    const rows = await db.readings.toArray();
    expect(rows.map((r) => [r.stationId, r.state, r.deviceId])).toEqual([["bore/2/top/A", "synced", "tab-other"]]);
  });

  it("a reading taken by someone else waits for their session", async () => {
    const db = await freshDb();
    const server = new FakeServer();
    await enter(db, BORES.slice(0, 1));
    await setMeta(db, "actor", { userId: 99, shopId: 1, name: "Dev", email: "d@x.example", role: "lead" });
    await engineFor(db, server).sync("manual");
    expect(server.pushes).toBe(0);
    expect(await states(db)).toEqual(["pending"]);
  });
});
