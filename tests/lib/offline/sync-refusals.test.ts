// A batch the server will never take is not sent again as it was: a retryable failure (no network,
// 5xx, 503 while the server's database restarts, 429) waits and retries, honouring Retry-After; a
// permanent refusal (400/413/415/422 of the batch) marks the readings it names refused with the
// server's words and sends the others at once, or narrows an unnamed refusal down one reading at a
// time. Refused readings stay on the tablet, shown on the bench, until fixed and sent again.
import "fake-indexeddb/auto";
import { afterEach, describe, expect, it } from "vitest";
import type { BenchDb } from "@/lib/offline/db";
import { getSyncStatus } from "@/lib/offline/meta";
import { resendReading } from "@/lib/offline/readings";
import { errorsByReading } from "@/lib/offline/refusal";
import { SyncEngine } from "@/lib/offline/sync-engine";
import { FakeServer } from "./fake-server";
import { enter, freshDb } from "./helpers";

const engines: SyncEngine[] = [];
afterEach(() => engines.splice(0).forEach((e) => e.stop()));
function engineFor(db: BenchDb, server: FakeServer, now = () => new Date()) {
  const e = new SyncEngine({ db, fetch: server.fetch, baseUrl: "http://tw.test", random: () => 0.5, now });
  engines.push(e);
  return e;
}

const BORES: [string, number][] = [
  ["bore/1/top/A", 4.0302],
  ["bore/1/top/B", 4.0301],
  ["bore/1/mid/A", 4.0303],
  ["bore/1/mid/B", 4.03],
];
/** The figure the fake server will never take in these tests. */
const BAD = 4.0303;

const reply = (status: number, error: Record<string, unknown>, headers: Record<string, string> = {}) =>
  new Response(JSON.stringify({ error }), { status, headers: { "Content-Type": "application/json", ...headers } });

/** The readings of a push, when the request is one. */
function pushed(url: URL, init: RequestInit): { value?: number | null }[] | null {
  if (url.pathname !== "/api/sync" || init.method !== "POST") return null;
  return (JSON.parse(String(init.body)) as { readings: { value?: number | null }[] }).readings;
}

const byValue = async (db: BenchDb) =>
  Object.fromEntries((await db.readings.toArray()).map((r) => [r.value, r.state])) as Record<number, string>;

describe("a batch the server will never take", () => {
  it("a 422 naming a reading (readings.2.note): that one is refused with the server's words, the rest go at once", async () => {
    const db = await freshDb();
    const server = new FakeServer();
    await enter(db, BORES);
    let refusals = 0;
    server.before = (url, init) => {
      const readings = pushed(url, init);
      const at = readings?.findIndex((r) => r.value === BAD) ?? -1;
      if (at < 0) return;
      refusals++;
      return reply(422, {
        code: "invalid",
        message: "Some fields need fixing",
        fields: { [`readings.${at}.note`]: ["Remove the control characters from the note"] },
      });
    };
    await engineFor(db, server).sync("manual");
    expect(refusals).toBe(1);
    expect(await byValue(db)).toEqual({ 4.0302: "synced", 4.0301: "synced", 4.0303: "rejected", 4.03: "synced" });
    const bad = (await db.readings.toArray()).find((r) => r.value === BAD)!;
    expect(bad.rejection).toEqual({
      code: "invalid",
      reason: "Remove the control characters from the note",
      errors: { note: ["Remove the control characters from the note"] },
    });
    expect(await db.outbox.count()).toBe(0);
    expect((await getSyncStatus(db)).lastOutcome).toBe("sent");
  });

  it("a refusal that names no reading is narrowed down one at a time: only the bad one ends refused", async () => {
    const db = await freshDb();
    const server = new FakeServer();
    await enter(db, BORES);
    const sizes: number[] = [];
    server.before = (url, init) => {
      const readings = pushed(url, init);
      if (!readings) return;
      sizes.push(readings.length);
      if (readings.some((r) => r.value === BAD))
        return reply(422, {
          code: "invalid",
          message: "Dial reading: This figure is outside the range the database keeps; check it",
          fields: { dialDeviation: ["This figure is outside the range the database keeps; check it"] },
        });
    };
    await engineFor(db, server).sync("manual");
    expect(sizes).toEqual([4, 1, 1, 1, 1]);
    expect(await byValue(db)).toEqual({ 4.0302: "synced", 4.0301: "synced", 4.0303: "rejected", 4.03: "synced" });
    const bad = (await db.readings.toArray()).find((r) => r.value === BAD)!;
    expect(bad.rejection?.reason).toBe("Dial reading: This figure is outside the range the database keeps; check it");
    // Never lost: fixed by the machinist, it goes again and is stored.
    server.before = undefined;
    await resendReading(db, bad.id, { value: 4.0304 });
    await engineFor(db, server).sync("manual");
    expect((await db.readings.get(bad.id))?.state).toBe("synced");
    expect(server.stored.size).toBe(4);
  });

  it("415 and 400 are refusals too; a single reading too large for the server (413) is refused, not retried", async () => {
    for (const status of [400, 413, 415]) {
      const db = await freshDb();
      const server = new FakeServer();
      await enter(db, BORES.slice(2, 4));
      server.before = (url, init) =>
        pushed(url, init)?.some((r) => r.value === BAD)
          ? reply(status, { code: `refused_${status}`, message: `Refused with ${status}` })
          : undefined;
      await engineFor(db, server).sync("manual");
      expect({ status, states: await byValue(db) }).toEqual({ status, states: { 4.0303: "rejected", 4.03: "synced" } });
    }
  });
});

describe("a failure worth retrying", () => {
  it("503 while the database restarts: nothing refused, the retry waits at least the server's Retry-After", async () => {
    const db = await freshDb();
    const server = new FakeServer();
    await enter(db, BORES.slice(0, 2));
    const now = new Date("2026-12-03T09:00:00Z");
    server.before = (url, init) =>
      pushed(url, init)
        ? reply(
            503,
            { code: "unavailable", message: "The server cannot reach its database", retryAfter: 90 },
            {
              "Retry-After": "90",
            },
          )
        : undefined;
    const engine = engineFor(db, server, () => now);
    await engine.sync("manual");
    const status = await getSyncStatus(db);
    expect(status).toMatchObject({ failures: 1, needsAction: false, lastOutcome: "server_error" });
    expect(status.lastError).toMatch(/cannot reach its database/);
    // backoff alone would be 1.5 s (base 2 s, jitter 0.5); the server asked for 90 s.
    expect(Date.parse(status.nextAttemptAt!) - now.getTime()).toBe(90_000);
    expect(Object.values(await byValue(db))).toEqual(["pending", "pending"]);
    server.before = undefined;
    await engine.sync("online");
    expect(Object.values(await byValue(db))).toEqual(["synced", "synced"]);
  });

  it("429 and 500 are retried later, never turned into refusals", async () => {
    for (const [status, headers] of [
      [429, { "Retry-After": "20" }],
      [500, {}],
    ] as const) {
      const db = await freshDb();
      const server = new FakeServer();
      await enter(db, BORES.slice(0, 1));
      server.before = (url, init) =>
        pushed(url, init) ? reply(status, { code: "x", message: "x" }, headers) : undefined;
      const engine = engineFor(db, server);
      await engine.sync("manual");
      await engine.sync("manual");
      expect({ status, outbox: await db.outbox.count(), state: Object.values(await byValue(db)) }).toEqual({
        status,
        outbox: 1,
        state: ["pending"],
      });
      expect((await getSyncStatus(db)).needsAction).toBe(false);
    }
  });
});

describe("errorsByReading", () => {
  it("groups a refusal's field errors by the reading they name, ignoring the batch's own fields", () => {
    const found = errorsByReading(
      {
        "readings.0.value": ["Enter a value"],
        "items.2.note": ["Too long"],
        "readings.2.skipReason": ["Say why"],
        "readings.9.note": ["out of this batch"],
        deviceId: ["deviceId is needed"],
      },
      3,
    );
    expect([...found.entries()]).toEqual([
      [0, { value: ["Enter a value"] }],
      [2, { note: ["Too long"], skipReason: ["Say why"] }],
    ]);
  });
});
