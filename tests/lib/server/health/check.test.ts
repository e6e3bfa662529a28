import { describe, expect, it } from "vitest";
import { checkHealth, healthOf, PROBE_TIMEOUT_MS } from "@/lib/server/health/check";

// Galera's node states are those of wsrep_local_state_comment (MariaDB Galera documentation):
// Joining, Waiting on SST, Joined, Synced, Donor/Desynced; only Synced serves current data.
describe("healthOf", () => {
  it("is ok on a one-node server without Galera once it answers", () => {
    expect(healthOf({ wsrepOn: false, state: null })).toEqual({ status: "ok", database: "reachable", node: "single" });
  });

  it("is ok on a Synced Galera node", () => {
    expect(healthOf({ wsrepOn: true, state: "Synced" }).status).toBe("ok");
  });

  it.each(["Joining", "Joined", "Donor/Desynced", "Initialized", null])("is unavailable on a node %s", (state) => {
    expect(healthOf({ wsrepOn: true, state })).toEqual({
      status: "unavailable",
      database: "reachable",
      node: "not-synced",
    });
  });

  it("is unavailable when the database did not answer", () => {
    expect(healthOf(null)).toMatchObject({ status: "unavailable", database: "unreachable" });
  });
});

describe("checkHealth", () => {
  it("turns a refused connection into unavailable, not a thrown error", async () => {
    const refused = () => Promise.reject(new Error("connect ECONNREFUSED 127.0.0.1:3306"));
    expect(await checkHealth(refused)).toMatchObject({ status: "unavailable", database: "unreachable" });
  });

  it("gives up on a database that hangs after the probe timeout", async () => {
    const started = Date.now();
    const hangs = () => new Promise<never>(() => {});
    expect(await checkHealth(hangs)).toMatchObject({ database: "unreachable" });
    expect(Date.now() - started).toBeGreaterThanOrEqual(PROBE_TIMEOUT_MS - 50);
    expect(Date.now() - started).toBeLessThan(PROBE_TIMEOUT_MS + 1000);
  });

  it("passes a Synced node's answer through", async () => {
    expect(await checkHealth(async () => ({ wsrepOn: true, state: "Synced" }))).toMatchObject({ node: "synced" });
  });
});
