import "fake-indexeddb/auto";
import { afterEach, describe, expect, it } from "vitest";
import type { BenchDb } from "@/lib/offline/db";
import { getSyncStatus, IDLE_STATUS, type SyncStatus } from "@/lib/offline/meta";
import { SyncEngine } from "@/lib/offline/sync-engine";
import { connectionOf, CONNECTION_WORDS, waitingWords } from "@/lib/offline/sync-state";
import { FakeServer } from "./fake-server";
import { enter, freshDb } from "./helpers";

// The badge says whether the SERVER is reachable: from the engine's last run, with the device's
// network deciding only "offline". With the server down and the network up it once said "Online"
// beside "No connection to the server".
const engines: SyncEngine[] = [];
afterEach(() => engines.splice(0).forEach((e) => e.stop()));
async function runOnce(db: BenchDb, server: FakeServer) {
  const engine = new SyncEngine({ db, fetch: server.fetch, baseUrl: "http://tw.test", random: () => 0.5 });
  engines.push(engine);
  await engine.sync("manual");
  return getSyncStatus(db);
}
const status = (patch: Partial<SyncStatus>): SyncStatus => ({ ...IDLE_STATUS, ...patch });

describe("the engine records how its last run ended", () => {
  it("sent; the server not reached; the server's 5xx; a refusal that needs a person", async () => {
    const db = await freshDb();
    await enter(db, [["bore/1/top/A", 4.0302]]);
    const server = new FakeServer();
    server.before = () => {
      throw new TypeError("Failed to fetch"); // what fetch throws when nothing answers
    };
    expect(await runOnce(db, server)).toMatchObject({
      lastOutcome: "unreachable",
      lastError: "No connection to the server",
    });
    server.before = undefined;
    server.status = 502;
    expect((await runOnce(db, server)).lastOutcome).toBe("server_error");
    server.status = 401;
    expect((await runOnce(db, server)).lastOutcome).toBe("refused");
    server.status = 0;
    expect(await runOnce(db, server)).toMatchObject({ lastOutcome: "sent", lastError: undefined });
  });
});

describe("one connection state from the last run and the device's network", () => {
  it("the server down with the network up is never called online", () => {
    const down = status({ lastOutcome: "unreachable", lastError: "No connection to the server" });
    expect(connectionOf(true, down)).toBe("unreachable");
    expect(CONNECTION_WORDS.unreachable).toBe("Network on, but the server is not reachable · kept on this tablet");
    expect(connectionOf(true, status({ lastOutcome: "server_error" }))).toBe("server_error");
    expect(connectionOf(true, status({ lastOutcome: "failed" }))).toBe("tablet_fault");
  });

  it("reachable only after an answer from the server; no network is offline whatever the last run said", () => {
    expect(connectionOf(true, status({ lastOutcome: "sent" }))).toBe("reachable");
    expect(connectionOf(true, status({ lastOutcome: "refused", needsAction: true }))).toBe("reachable");
    expect(connectionOf(false, status({ lastOutcome: "sent" }))).toBe("offline");
    expect(connectionOf(true, IDLE_STATUS)).toBe("not_checked");
  });

  it("a run under way after a failure is a fresh look; after a success the server stays reachable", () => {
    expect(connectionOf(true, status({ running: true, lastOutcome: "unreachable" }))).toBe("checking");
    expect(connectionOf(true, status({ running: true }))).toBe("checking");
    expect(connectionOf(true, status({ running: true, lastOutcome: "sent" }))).toBe("reachable");
  });
});

describe("what waits to be sent, in words", () => {
  it("counts readings and photos", () => {
    expect(waitingWords(0, 0)).toBe("");
    expect(waitingWords(1, 0)).toBe("1 reading waits to be sent");
    expect(waitingWords(0, 2)).toBe("2 photos wait to be sent");
    expect(waitingWords(3, 1)).toBe("3 readings and 1 photo wait to be sent");
  });
});
