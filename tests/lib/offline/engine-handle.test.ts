import "fake-indexeddb/auto";
import { describe, expect, it, vi } from "vitest";
import { lazyEngine } from "@/lib/offline/engine-handle";
import { freshDb } from "./helpers";

// A stand-in engine module: records what the handle passes on once the code has "loaded".
function fakeModule() {
  const calls: string[] = [];
  class SyncEngine {
    constructor(readonly o: unknown) {}
    start() {
      calls.push("start");
    }
    afterEntry() {
      calls.push("afterEntry");
    }
    async sync(reason: string) {
      calls.push(`sync:${reason}`);
    }
  }
  return { calls, load: vi.fn(async () => ({ SyncEngine }) as unknown as typeof import("@/lib/offline/sync-engine")) };
}

describe("sync engine loaded on demand", () => {
  it("an entry before the code arrives is covered by the start-up sync; later calls go straight through", async () => {
    const db = await freshDb();
    const m = fakeModule();
    const handle = lazyEngine(db, m.load);
    handle.afterEntry(); // nothing loaded yet: nothing lost, nothing thrown
    expect(m.load).not.toHaveBeenCalled();
    await handle.start();
    await handle.start(); // loads and starts once
    expect(m.load).toHaveBeenCalledTimes(1);
    handle.afterEntry();
    await handle.sync("manual");
    expect(m.calls).toEqual(["start", "afterEntry", "sync:manual"]);
  });

  it("a tap on Send now before the code arrives loads it and syncs", async () => {
    const db = await freshDb();
    const m = fakeModule();
    await lazyEngine(db, m.load).sync("manual");
    expect(m.calls).toEqual(["start", "sync:manual"]);
  });
});
