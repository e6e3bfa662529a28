// A shared tablet: signing out locks it with no network, each person's unsent readings stay under
// their name and go out only under their own next session, and a session signed out here is
// reported to the server once it answers.
import "fake-indexeddb/auto";
import { afterEach, describe, expect, it } from "vitest";
import type { BenchDb } from "@/lib/offline/db";
import { getMeta, setMeta, type DeviceActor } from "@/lib/offline/meta";
import {
  endedSessions,
  lockDevice,
  NOTICE,
  rememberActor,
  reportEndedSessions,
  signOutHere,
  waitingByPerson,
  type SignOutNotice,
} from "@/lib/offline/sign-out";
import { SyncEngine } from "@/lib/offline/sync-engine";
import { TAKEN_BY_HEADER } from "@/lib/schemas/sync-headers";
import { FakeServer } from "./fake-server";
import { bore, enter, freshDb } from "./helpers";
import { recordReading } from "@/lib/offline/readings";

const ROSA: DeviceActor = {
  userId: 7,
  shopId: 1,
  name: "Rosa",
  email: "rosa@x.example",
  role: "machinist",
  sessionId: "a".repeat(32),
};
const DEV: DeviceActor = {
  userId: 9,
  shopId: 1,
  name: "Dev",
  email: "dev@x.example",
  role: "lead",
  sessionId: "b".repeat(32),
};
const offline = async (): Promise<Response> => {
  throw new TypeError("Failed to fetch");
};

const engines: SyncEngine[] = [];
afterEach(() => engines.splice(0).forEach((e) => e.stop()));

async function rosaWithTwoWaiting(): Promise<BenchDb> {
  const db = await freshDb();
  await rememberActor(db, ROSA);
  await enter(db, [
    ["bore/1/top/A", 4.0302],
    ["bore/1/top/B", 4.0301],
  ]);
  return db;
}

describe("signing out on a shared tablet", () => {
  it("locks with no network: nobody is remembered, Rosa's readings stay queued under her, the count is kept", async () => {
    const db = await rosaWithTwoWaiting();
    await signOutHere(db, offline, 50);
    expect(await getMeta(db, "actor")).toBeUndefined();
    expect(await getMeta<SignOutNotice>(db, NOTICE)).toMatchObject({
      name: "Rosa",
      readings: 2,
      photos: 0,
      studies: 0,
    });
    expect((await db.outbox.toArray()).map((r) => r.takenBy)).toEqual([7, 7]);
    expect(await db.readings.count()).toBe(2);
    expect(await endedSessions(db)).toEqual([ROSA.sessionId]);
    expect(await waitingByPerson(db)).toEqual([{ userId: 7, name: "Rosa", readings: 2, photos: 0, studies: 0 }]);
  });

  it("with nobody signed in on the tablet there is nothing to lock or report", async () => {
    const db = await freshDb();
    await db.meta.delete("actor");
    expect(await lockDevice(db)).toBeNull();
    expect(await endedSessions(db)).toEqual([]);
  });

  it("reports the ended session once the server answers, and keeps it while it does not", async () => {
    const db = await rosaWithTwoWaiting();
    await lockDevice(db);
    expect(await reportEndedSessions(db, offline)).toBe(false);
    expect(await reportEndedSessions(db, async () => new Response(null, { status: 503 }))).toBe(false);
    expect(await endedSessions(db)).toEqual([ROSA.sessionId]);
    const sent: unknown[] = [];
    const server = async (_url: RequestInfo | URL, init?: RequestInit) => {
      sent.push([init?.method, JSON.parse(String(init?.body))]);
      return new Response(null, { status: 204 });
    };
    expect(await reportEndedSessions(db, server)).toBe(true);
    expect(sent).toEqual([["DELETE", { sessionId: ROSA.sessionId }]]);
    expect(await endedSessions(db)).toEqual([]);
  });

  it("Dev's session never sends Rosa's readings; Rosa's next session sends them", async () => {
    const db = await rosaWithTwoWaiting();
    await signOutHere(db, offline, 50);
    const server = new FakeServer();
    const pushedAs: (string | null)[] = [];
    server.before = (url, init) => {
      if (url.pathname === "/api/sync" && init.method === "POST")
        pushedAs.push(new Headers(init.headers).get(TAKEN_BY_HEADER));
    };
    const engine = () => {
      const e = new SyncEngine({ db, fetch: server.fetch, baseUrl: "http://tw.test", random: () => 0.5 });
      engines.push(e);
      return e;
    };

    await rememberActor(db, DEV);
    await recordReading(db, bore("bore/2/top/A", 4.0303), { deviceId: "tab-test", takenBy: DEV.userId });
    await engine().sync("manual");
    expect(pushedAs).toEqual(["9"]);
    expect([...server.stored.values()].map((s) => s.sent.stationId)).toEqual(["bore/2/top/A"]);
    expect((await db.outbox.toArray()).map((r) => r.takenBy)).toEqual([7, 7]);
    expect(await waitingByPerson(db)).toEqual([{ userId: 7, name: "Rosa", readings: 2, photos: 0, studies: 0 }]);

    await signOutHere(db, offline, 50);
    await rememberActor(db, { ...ROSA, sessionId: "c".repeat(32) });
    expect(await getMeta(db, NOTICE)).toBeUndefined();
    await engine().sync("manual");
    expect(pushedAs).toEqual(["9", "7"]);
    expect(server.stored.size).toBe(3);
    expect(await db.outbox.count()).toBe(0);
  });

  it("the list of waiting work names each person, most waiting first", async () => {
    const db = await rosaWithTwoWaiting();
    await lockDevice(db);
    await rememberActor(db, DEV);
    await recordReading(db, bore("bore/2/top/A", 4.0303), { deviceId: "tab-test", takenBy: DEV.userId });
    await setMeta(db, "people", { 7: "Rosa" }); // Dev's name forgotten (an old tablet): still counted
    expect(await waitingByPerson(db)).toEqual([
      { userId: 7, name: "Rosa", readings: 2, photos: 0, studies: 0 },
      { userId: 9, name: "Someone", readings: 1, photos: 0, studies: 0 },
    ]);
  });
});
