// The CSV's current readings come from SQL (so a job's history is never held in memory); they must
// be the ones lib/domain's currentReadings picks from the same rows (the product's one rule): a
// correction replaces what it supersedes wherever the chain is, of two readings nothing supersedes
// the later taken wins and then the larger id, a skip can be current. Invented test figures.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { currentReadings } from "@/lib/domain";
import { currentJobReadings, jobReadings } from "@/lib/server/readings/repo";
import { createShop, insertReading, type TestShop } from "../support/factories";

let s: TestShop;
beforeAll(async () => {
  s = await createShop();
});

describe("currentJobReadings", () => {
  it("picks the readings lib/domain's rule picks, chains, ties and skips included", async () => {
    const at = "bore/1/top/A";
    const first = await insertReading(s, at, 4.0312, 0);
    const fix = await insertReading(s, at, 4.0302, 5, { supersedes: first.id });
    // Taken earlier than the correction, but it replaces nothing: the correction is later, so current.
    await insertReading(s, at, 4.0305, 3);
    // Two tablets at one station at the same minute, nothing superseded: the larger id wins.
    const [lo, hi] = [randomUUID(), randomUUID()].sort();
    await insertReading(s, "bore/1/top/B", 4.0301, 10, { id: lo });
    await insertReading(s, "bore/1/top/B", 4.0303, 10, { id: hi });
    // A chain whose last link is a skip: the station has a skip as its current reading.
    const m = await insertReading(s, "bore/1/mid/A", 4.03, 1);
    const m2 = await insertReading(s, "bore/1/mid/A", 4.0304, 2, { supersedes: m.id });
    await insertReading(s, "bore/1/mid/A", null, 4, { supersedes: m2.id });
    // A correction taken before what it corrects (a tablet's clock behind): still the current one.
    const late = await insertReading(s, "bore/2/top/A", 4.031, 30);
    const early = await insertReading(s, "bore/2/top/A", 4.0309, 20, { supersedes: late.id });

    const fromSql = await currentJobReadings(s.job.id);
    const byRule = currentReadings(await jobReadings(undefined, s.job.id));
    expect(fromSql.map((r) => r.id).sort()).toEqual([...byRule.values()].map((r) => r.id).sort());
    const ids = new Map(fromSql.map((r) => [r.stationId, r.id]));
    expect(ids.get(at)).toBe(fix.id);
    expect(ids.get("bore/1/top/B")).toBe(hi);
    expect(fromSql.find((r) => r.stationId === "bore/1/mid/A")?.skipped).toBe(true);
    expect(ids.get("bore/2/top/A")).toBe(early.id);
  });
});
