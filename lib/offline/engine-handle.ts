// What the screens need of the sync engine, usable before the engine's code has loaded: the
// engine (with the outbox, feed, photo and HTTP code) is fetched after the bench's first paint,
// so it stays out of the first-load JavaScript. Calls made before it arrives are kept and replayed.
import type { BenchDb } from "./db";
import type { SyncEngine, SyncReason } from "./sync-engine";

export interface EngineHandle {
  afterEntry(): void;
  sync(reason: SyncReason): Promise<void>;
}

export function lazyEngine(
  db: BenchDb,
  load: () => Promise<typeof import("./sync-engine")>,
): EngineHandle & { start(): Promise<SyncEngine> } {
  let engine: SyncEngine | undefined;
  let starting: Promise<SyncEngine> | undefined;
  const start = () =>
    (starting ??= load().then(({ SyncEngine: Engine }) => {
      engine = new Engine({ db });
      engine.start(); // syncs at once: that covers any entry made while the code was loading
      return engine;
    }));
  return {
    start,
    afterEntry: () => engine?.afterEntry(),
    sync: (reason) => (engine ? engine.sync(reason) : start().then((e) => e.sync(reason))),
  };
}
