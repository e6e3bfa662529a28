import "fake-indexeddb/auto";
import Dexie from "dexie";
import { describe, expect, it, vi } from "vitest";
import { addTogether } from "@/lib/offline/add-together";
import { recordReading } from "@/lib/offline/readings";
import { CTX, bore, freshDb } from "./helpers";

// The entry's write: a reading and its outbox row in one native transaction, or neither.
vi.mock("@/lib/offline/ids", () => ({ uuidv4: () => "00000000-0000-4000-8000-000000000001" }));

const OUTBOX = {
  readingId: "00000000-0000-4000-8000-000000000001",
  jobId: 1,
  takenBy: 7,
  queuedAt: "2026-12-01T08:00:00.000Z",
  attempts: 0,
};

describe("addTogether", () => {
  it("stores the reading and its outbox row together", async () => {
    const db = await freshDb();
    const r = await recordReading(db, bore("bore/1/top/A", 4.0302), CTX);
    expect(await db.readings.get(r.id)).toMatchObject({ state: "pending", value: 4.0302, takenBy: 7 });
    expect(await db.outbox.get(r.id)).toMatchObject({ readingId: r.id, attempts: 0 });
  });

  it("stores neither when the outbox row cannot be written, and says so", async () => {
    const db = await freshDb();
    await db.outbox.add(OUTBOX); // the same key already queued: the second add fails inside the transaction
    await expect(recordReading(db, bore("bore/1/top/A", 4.0302), CTX)).rejects.toThrow();
    expect(await db.readings.count()).toBe(0);
    expect(await db.outbox.count()).toBe(1);
  });

  it("stores neither when a row cannot be stored at all", async () => {
    const db = await freshDb();
    const bad = { id: "x", jobId: 1, state: "pending", oops: () => 1 }; // functions cannot be stored
    await expect(
      addTogether(db, [
        { table: "outbox", row: { ...OUTBOX, readingId: "x" }, key: "x" },
        { table: "readings", row: bad, key: "x" },
      ]),
    ).rejects.toThrow();
    expect(await db.outbox.count()).toBe(0);
  });

  it("tells Dexie's observers which tables changed, after the write is safe", async () => {
    const db = await freshDb();
    const heard: string[][] = [];
    const listener = (parts: Record<string, unknown>) => void heard.push(Object.keys(parts));
    Dexie.on("storagemutated", listener);
    try {
      await recordReading(db, bore("bore/1/top/A", 4.0302), CTX);
      await vi.waitFor(() => expect(heard.flat()).toContain(`idb://${db.name}/readings/`));
      expect(heard.flat()).toEqual(
        expect.arrayContaining([
          `idb://${db.name}/outbox/`,
          `idb://${db.name}/readings/jobId`,
          `idb://${db.name}/outbox/takenBy`,
        ]),
      );
    } finally {
      Dexie.on("storagemutated").unsubscribe(listener);
    }
  });

  it("writes through Dexie when the database is closed, reopening it", async () => {
    const db = await freshDb();
    db.close({ disableAutoOpen: false });
    await recordReading(db, bore("bore/1/top/A", 4.0302), CTX);
    expect(await db.outbox.count()).toBe(1);
    expect(await db.readings.count()).toBe(1);
  });
});
