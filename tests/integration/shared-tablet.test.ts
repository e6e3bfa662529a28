// Two people on one tablet against the real sync handler and MariaDB: what Rosa entered before
// signing out is never sent under Dev's session (not by the engine, and not by the server even if
// a browser sends it so), and it is stored as Rosa's once her own next session sends it.
import "fake-indexeddb/auto";
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { BenchDb } from "@/lib/offline/db";
import { getSyncStatus, type DeviceActor } from "@/lib/offline/meta";
import { savePack } from "@/lib/offline/packs";
import { recordReading } from "@/lib/offline/readings";
import { lockDevice, rememberActor } from "@/lib/offline/sign-out";
import { SyncEngine } from "@/lib/offline/sync-engine";
import { getJson, type Fetch } from "@/lib/offline/transport";
import type { JobPack } from "@/lib/schemas/sync";
import { getSequelize } from "@/lib/server/core/db";
import { createShop, gaugeFor, type TestShop, type TestUser } from "../support/factories";
import { handlerFetch } from "../support/handler-fetch";

const BASE = "http://localhost";
let shop: TestShop;
beforeAll(async () => {
  shop = await createShop();
});

const actorOf = (u: TestUser): DeviceActor => ({
  userId: u.id,
  shopId: u.shopId,
  name: u.name,
  email: u.email,
  role: u.role,
});

/** A bore reading on the shop's job with the shop's bore gauge (a reading names a suitable gauge). */
const bore = (stationId: string, value: number) => ({
  jobId: shop.job.id,
  stationId,
  value,
  unit: "in" as const,
  instrumentId: gaugeFor(shop.shop.id, stationId),
});

async function takers(jobId: number): Promise<Record<string, number>> {
  const rows = await getSequelize().query<{ station_id: string; taken_by: number }>(
    "SELECT station_id, taken_by FROM readings WHERE job_id = ?",
    { replacements: [jobId], type: "SELECT" as never },
  );
  return Object.fromEntries(rows.map((r) => [r.station_id, r.taken_by]));
}

describe("a shared tablet against the real server", () => {
  it("Dev's session never sends Rosa's readings; her next session does, stored as hers", async () => {
    const rosa = shop.users.machinist;
    const dev = shop.users.lead;
    const db = new BenchDb(`shared-${randomUUID()}`);
    const asRosa = handlerFetch(rosa);
    const asDev = handlerFetch(dev);
    const engine = (fetch: Fetch) => new SyncEngine({ db, fetch, baseUrl: BASE, random: () => 0.5 });
    await savePack(db, await getJson<JobPack>(asRosa.fetch, `${BASE}/api/bench/jobs/${shop.job.id}`));

    await rememberActor(db, actorOf(rosa));
    const ctx = { deviceId: "tab-shared", takenBy: rosa.id };
    await recordReading(db, bore("bore/1/top/A", 4.0302), ctx);
    await recordReading(db, bore("bore/1/top/B", 4.0301), ctx);

    // Another tab signed this browser in as Dev while the tablet still believed Rosa was measuring:
    // the server refuses the push, nothing is written, and her readings stay queued.
    const stale = engine(asDev.fetch);
    await stale.sync("manual");
    stale.stop();
    expect(asDev.pushes().map((p) => p.status)).toEqual([409]);
    expect(await takers(shop.job.id)).toEqual({});
    expect((await getSyncStatus(db)).lastError).toMatch(/did not take these readings/);
    expect(await db.outbox.count()).toBe(2);

    // Rosa signs out; Dev signs in and works: only his reading goes, under his name.
    await lockDevice(db);
    await rememberActor(db, actorOf(dev));
    await recordReading(db, bore("bore/2/top/A", 4.0303), { deviceId: "tab-shared", takenBy: dev.id });
    const devs = engine(asDev.fetch);
    await devs.sync("manual");
    devs.stop();
    expect(await takers(shop.job.id)).toEqual({ "bore/2/top/A": dev.id });
    expect((await db.outbox.toArray()).map((r) => r.takenBy)).toEqual([rosa.id, rosa.id]);

    // Rosa signs in again: hers go out, stored as taken by her.
    await lockDevice(db);
    await rememberActor(db, actorOf(rosa));
    const hers = engine(asRosa.fetch);
    await hers.sync("manual");
    hers.stop();
    expect(await takers(shop.job.id)).toEqual({
      "bore/1/top/A": rosa.id,
      "bore/1/top/B": rosa.id,
      "bore/2/top/A": dev.id,
    });
    expect(await db.outbox.count()).toBe(0);
  });
});
