// A job's cached context is never used stale across nodes: the lead edits the limits through one
// app instance (its node), and a tablet's next batch through the other instance, on another node,
// straight after, is judged with the new limits, although that instance holds the job's context
// from its earlier batches in memory.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeNodeDbs, everyNodeCaughtUp, http, serverCodeOnNode } from "../support/cluster-nodes";
import { createShop, gaugeFor, INCH_LIMITS, type TestShop } from "../support/factories";
import { reading } from "../api/sync-fixtures";

serverCodeOnNode(2);

let s: TestShop;
beforeAll(async () => {
  s = await createShop();
  await everyNodeCaughtUp();
});
afterAll(closeNodeDbs);

/** Bore limits 4.03 in, minus 0.0005, plus `plus` (test fixture figures). */
const withBorePlus = (plus: number) =>
  INCH_LIMITS.map((l) => (l.characteristic === "bore_diameter" ? { ...l, tolPlus: plus } : l));

async function pushOne(station: string, value: number) {
  const r = { ...reading(s.job.id, station, value), instrumentId: gaugeFor(s.shop.id, station) };
  const res = await http(1, s.users.machinist, "POST", "/api/sync", { deviceId: "tab-context", readings: [r] });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body.results[0].verdict as string;
}

describe("job context across nodes", () => {
  it("judges a batch through node 2 with limits saved through node 1 a moment before", async () => {
    // The instance on node 2 loads and keeps the job's context.
    expect(await pushOne("bore/1/top/A", 4.0301)).not.toBe("out_of_spec");
    const rounds = [0.0001, 0.0005, 0.0001, 0.0005];
    for (const [i, plus] of rounds.entries()) {
      const current = await http(0, s.users.lead, "GET", `/api/jobs/${s.job.id}/limits`);
      const saved = await http(0, s.users.lead, "PUT", `/api/jobs/${s.job.id}/limits`, {
        specRevision: current.body.job.specRevision,
        limits: withBorePlus(plus),
        confirmedFlagsOpened: null,
      });
      expect(saved.status, JSON.stringify(saved.body)).toBe(200);
      // 4.0303 in: outside 4.03 +0.0001, inside 4.03 +0.0005.
      const verdict = await pushOne(`bore/${i + 2}/top/A`, 4.0303);
      if (plus === 0.0001) expect(verdict, `round ${i + 1}`).toBe("out_of_spec");
      else expect(verdict, `round ${i + 1}`).not.toBe("out_of_spec");
    }
  });
});
