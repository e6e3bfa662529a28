// The CSV's current readings are picked from the job's rows as they stream past (so a job's history
// is never held in memory); they must be the ones lib/domain's currentReadings picks from the same
// rows read whole (the product's one rule): a
// correction replaces what it supersedes wherever the chain is, of two readings nothing supersedes
// the later taken wins and then the larger id, a skip can be current. Invented test figures.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { currentReadings } from "@/lib/domain";
import { withReads } from "@/lib/server/core/sql-read";
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

    const streamed = await currentJobReadings(s.job.id);
    const byRule = currentReadings(await jobReadings(undefined, s.job.id));
    expect(streamed.map((r) => r.id).sort()).toEqual([...byRule.values()].map((r) => r.id).sort());
    const ids = new Map(streamed.map((r) => [r.stationId, r.id]));
    expect(ids.get(at)).toBe(fix.id);
    expect(ids.get("bore/1/top/B")).toBe(hi);
    expect(streamed.find((r) => r.stationId === "bore/1/mid/A")?.skipped).toBe(true);
    expect(ids.get("bore/2/top/A")).toBe(early.id);
    // Oldest first, as jobReadings orders them.
    const times = streamed.map((r) => r.takenAt.getTime());
    expect(times).toEqual([...times].sort((a, b) => a - b));
  });
});

describe("a streamed read (sql-read.ts)", () => {
  it("reports a failing statement and leaves the connection usable for the next read", async () => {
    const [failed, after] = await withReads(async (read, stream) => {
      const bad = stream("SELECT no_such_column FROM readings WHERE job_id = ?", [s.job.id]);
      const next = read<{ n: number }>("SELECT COUNT(*) AS n FROM readings WHERE job_id = ?", [s.job.id]);
      const failure = await bad
        .each(() => undefined)
        .then(
          () => null,
          (e: Error) => e.message,
        );
      return [failure, await next];
    });
    expect(failed).toMatch(/no_such_column/);
    expect(after[0].n).toBeGreaterThan(0);
  });

  it("stops at a row its reader refuses, drops the rest, and the next read still answers", async () => {
    const [seen, failed, after] = await withReads(async (read, stream) => {
      let rows = 0;
      const failure = await stream("SELECT id FROM readings WHERE job_id = ?", [s.job.id])
        .each(() => {
          rows += 1;
          throw new Error("refused");
        })
        .then(
          () => null,
          (e: Error) => e.message,
        );
      return [rows, failure, await read<{ n: number }>("SELECT 1 AS n")];
    });
    expect(seen).toBe(1);
    expect(failed).toBe("refused");
    expect(after).toEqual([{ n: 1 }]);
  });
});
