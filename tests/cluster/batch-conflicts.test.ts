// Two batches touching the same rows at the same moment through two app instances on two nodes:
// Galera fails the later commit (1213, a certification conflict) and the batch runs again; each
// batch still ends all or nothing, with the replies and rows one database would give.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { causalSelect, closeNodeDbs, everyNodeCaughtUp, http, nodeStatus } from "../support/cluster-nodes";
import { serverCodeOnNode } from "../support/cluster-nodes";
import { createShop, gaugeFor, type TestShop } from "../support/factories";
import { reading } from "../api/sync-fixtures";

serverCodeOnNode(2);

let s: TestShop;
beforeAll(async () => {
  s = await createShop();
  await everyNodeCaughtUp();
});
afterAll(closeNodeDbs);

const withGauge = (station: string, value: number) => ({
  ...reading(s.job.id, station, value),
  instrumentId: gaugeFor(s.shop.id, station),
});
type Result = { id: string; status: string; replay?: boolean };

async function storedOnEveryNode(ids: string[]): Promise<number[]> {
  const counts = [];
  for (const node of [0, 1, 2]) {
    const [row] = await causalSelect<{ n: number }>(node, "SELECT COUNT(*) AS n FROM readings WHERE id IN (?)", [ids]);
    counts.push(Number(row.n));
  }
  return counts;
}

describe("batches racing through two nodes", () => {
  it("stores overlapping batches once each, the overlap as a replay in exactly one reply", async () => {
    const failuresBefore =
      (await nodeStatus(0, "wsrep_local_cert_failures")) + (await nodeStatus(1, "wsrep_local_cert_failures"));
    for (let round = 0; round < 8; round++) {
      const bore = round + 1;
      const [x1, x2, x3, x4] = ["top/A", "top/B", "mid/A", "mid/B"].map((at, k) =>
        withGauge(`bore/${bore}/${at}`, Number((4.0299 + k * 0.0001).toFixed(4))),
      );
      const [a, b] = await Promise.all([
        http(0, s.users.machinist, "POST", "/api/sync", { deviceId: "tab-race-A", readings: [x1, x2, x3] }),
        http(1, s.users.machinist, "POST", "/api/sync", { deviceId: "tab-race-B", readings: [x2, x3, x4] }),
      ]);
      expect([a.status, b.status], JSON.stringify([a.body, b.body])).toEqual([200, 200]);
      const all: Result[] = [...a.body.results, ...b.body.results];
      expect(all.every((r) => r.status === "accepted")).toBe(true);
      for (const shared of [x2, x3]) {
        const fresh = all.filter((r) => r.id === shared.id && r.replay === false);
        expect(fresh, `round ${round + 1}`).toHaveLength(1);
      }
      expect(await storedOnEveryNode([x1, x2, x3, x4].map((x) => x.id))).toEqual([4, 4, 4]);
    }
    const failuresAfter =
      (await nodeStatus(0, "wsrep_local_cert_failures")) + (await nodeStatus(1, "wsrep_local_cert_failures"));
    console.log(`[batches] certification conflicts retried on the two nodes: ${failuresAfter - failuresBefore}`);
  });

  it("a refused batch writes nothing while the other, racing it on the other node, is stored whole", async () => {
    const [x1, x2, x3] = ["bore/8/bottom/A", "bore/8/bottom/B", "bore/7/bottom/A"].map((at) => withGauge(at, 4.03));
    const bad = { ...withGauge("bore/8/mid/A", 4.03), stationId: "bore/8/nowhere/Z" };
    const [a, b] = await Promise.all([
      http(0, s.users.machinist, "POST", "/api/sync", { deviceId: "tab-race-A", readings: [x1, x2] }),
      http(1, s.users.machinist, "POST", "/api/sync", { deviceId: "tab-race-B", readings: [x2, x3, bad] }),
    ]);
    expect(a.status).toBe(200);
    expect(b.status).toBe(422);
    expect(await storedOnEveryNode([x1.id, x2.id])).toEqual([2, 2, 2]);
    expect(await storedOnEveryNode([x3.id, bad.id])).toEqual([0, 0, 0]);
  });
});
