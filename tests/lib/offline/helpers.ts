import "fake-indexeddb/auto";
import { BenchDb } from "@/lib/offline/db";
import { setMeta } from "@/lib/offline/meta";
import { savePack } from "@/lib/offline/packs";
import { recordReading, type NewReading } from "@/lib/offline/readings";
import { makePack } from "./fake-server";

let n = 0;
/** A fresh database (own name) with the machinist signed in and job 1 opened. */
export async function freshDb(name = `bench-test-${process.pid}-${++n}`): Promise<BenchDb> {
  const db = new BenchDb(name);
  await setMeta(db, "actor", { userId: 7, shopId: 1, name: "Rosa", email: "rosa@x.example", role: "machinist" });
  await savePack(db, makePack(1));
  return db;
}

export const CTX = { deviceId: "tab-test", takenBy: 7 };

export function bore(stationId: string, value: number, extra: Partial<NewReading> = {}): NewReading {
  return { jobId: 1, stationId, value, unit: "in", ...extra };
}

export async function enter(db: BenchDb, values: [string, number][], extra: Partial<NewReading> = {}) {
  const out = [];
  for (const [s, v] of values) out.push(await recordReading(db, bore(s, v, extra), CTX));
  return out;
}
