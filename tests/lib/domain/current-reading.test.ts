import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  correctedBy,
  currentReadings,
  currentValues,
  hasValue,
  supersededIds,
  takenLater,
  type ChainedReading,
} from "../../../lib/domain/current-reading";

// Every case here is a rule of this product (which reading a station currently shows); there is
// no outside source to cite.
type R = ChainedReading & { value: number | null; state?: string };
let n = 0;
const r = (stationId: string, takenAt: string, extra: Partial<R> = {}): R => ({
  id: `r${String(++n).padStart(3, "0")}`,
  stationId,
  takenAt,
  value: 1,
  ...extra,
});
const ids = (m: Map<string, R>) => Object.fromEntries([...m].map(([s, x]) => [s, x.id]));

describe("current reading of each station (rule of this product)", () => {
  it("the latest reading by time taken, one per station", () => {
    const a = r("bore/1/top/A", "2026-01-01T08:00:00Z");
    const b = r("bore/1/top/A", "2026-01-01T09:00:00Z");
    const c = r("bore/1/top/B", "2026-01-01T07:00:00Z");
    expect(ids(currentReadings([b, a, c]))).toEqual({ "bore/1/top/A": b.id, "bore/1/top/B": c.id });
  });

  it("a superseded reading is never current, even when it was taken later", () => {
    // The correction carries a tablet clock that ran behind: the chain still decides.
    const old = r("main/1/front/A", "2026-01-01T10:00:00Z");
    const fix = r("main/1/front/A", "2026-01-01T09:00:00Z", { supersedes: old.id });
    expect(currentReadings([old, fix]).get("main/1/front/A")).toBe(fix);
  });

  it("follows a chain of corrections to its end", () => {
    const a = r("deck/left/front", "2026-01-01T08:00:00Z");
    const b = r("deck/left/front", "2026-01-01T08:01:00Z", { supersedes: a.id });
    const c = r("deck/left/front", "2026-01-01T08:02:00Z", { supersedes: b.id });
    for (const order of [
      [a, b, c],
      [c, b, a],
      [b, c, a],
    ])
      expect(currentReadings(order).get("deck/left/front")).toBe(c);
  });

  it("a skip is a reading: when it is current the station has no current value", () => {
    const value = r("skirt/1", "2026-01-01T08:00:00Z");
    const skip = r("skirt/1", "2026-01-01T08:05:00Z", { skipped: true, value: null, supersedes: value.id });
    expect(currentReadings([value, skip]).get("skirt/1")).toBe(skip);
    expect(currentValues([value, skip])).toEqual([]);
  });

  it("a skip with no link to the earlier figure still wins when it is later (two tablets)", () => {
    const value = r("skirt/2", "2026-01-01T08:00:00Z");
    const skip = r("skirt/2", "2026-01-01T08:05:00Z", { skipped: true, value: null });
    expect(currentReadings([value, skip]).get("skirt/2")).toBe(skip);
    expect(currentValues([value, skip])).toEqual([]);
  });

  it("a figure taken after a skip makes the station measured again", () => {
    const skip = r("skirt/3", "2026-01-01T08:00:00Z", { skipped: true, value: null });
    const value = r("skirt/3", "2026-01-01T08:05:00Z", { supersedes: skip.id });
    expect(currentValues([skip, value])).toEqual([value]);
  });

  it("ties on time taken go to the larger id, whatever the order the rows come in", () => {
    const t = "2026-01-01T08:00:00Z";
    const a = { ...r("end-play", t), id: "aaaa" };
    const b = { ...r("end-play", t), id: "bbbb" };
    expect(currentReadings([a, b]).get("end-play")).toBe(b);
    expect(currentReadings([b, a]).get("end-play")).toBe(b);
  });

  it("compares times as instants: ISO text and Date agree", () => {
    const a = r("lash/1/int", "2026-01-01T08:00:00.000Z");
    const b = { ...r("lash/1/int", ""), takenAt: new Date("2026-01-01T08:00:01Z") };
    expect(takenLater(b, a)).toBe(true);
    expect(takenLater(a, b)).toBe(false);
  });

  it("the server's supersededBy retires a reading the tablet holds without its correction", () => {
    const a = r("bore/2/mid/A", "2026-01-01T08:00:00Z", { supersededBy: "elsewhere" });
    expect(currentReadings([a]).size).toBe(0);
    expect(supersededIds([a])).toEqual(new Set([a.id]));
  });

  it("a reading whose link does not count (refused by the server) replaces nothing but can be current", () => {
    const a = r("bore/3/mid/A", "2026-01-01T08:00:00Z");
    const refused = r("bore/3/mid/A", "2026-01-01T08:01:00Z", { supersedes: a.id, state: "rejected" });
    const m = currentReadings([a, refused], { replaces: (x) => x.state !== "rejected" });
    expect(m.get("bore/3/mid/A")).toBe(refused);
    const values = currentValues([a, refused], { replaces: (x) => x.state !== "rejected" });
    expect(values).toEqual([refused]);
    // Without the option the link counts and the earlier figure is history.
    expect(supersededIds([a, refused])).toEqual(new Set([a.id]));
  });

  it("correctedBy: each replaced reading with the reading that replaces it, the later when two do", () => {
    const a = r("main/2/rear/B", "2026-01-01T08:00:00Z");
    const b = r("main/2/rear/B", "2026-01-01T08:01:00Z", { supersedes: a.id });
    const c = r("main/2/rear/B", "2026-01-01T08:03:00Z", { supersedes: a.id }); // a second tablet
    const d = r("main/2/rear/B", "2026-01-01T08:04:00Z", { supersedes: c.id });
    expect(Object.fromEntries(correctedBy([c, d, a, b]))).toEqual({ [a.id]: c.id, [c.id]: d.id });
  });

  it("hasValue: a skip or a missing figure carries no value", () => {
    expect(hasValue({ value: 0 })).toBe(true);
    expect(hasValue({ value: null })).toBe(false);
    expect(hasValue({ value: 2, skipped: true })).toBe(false);
  });

  it("the answer never depends on the order of the readings", () => {
    const station = fc.constantFrom("bore/1/top/A", "bore/1/top/B", "deck/left/front");
    const reading = fc.record({
      id: fc.uuid(),
      stationId: station,
      takenAt: fc.integer({ min: 0, max: 5 }).map((m) => new Date(Date.UTC(2026, 0, 1, 8, m)).toISOString()),
      skipped: fc.boolean(),
    });
    fc.assert(
      fc.property(fc.uniqueArray(reading, { selector: (x) => x.id, maxLength: 12 }), (list) => {
        const linked = list.map((x, i) => (i > 0 && i % 3 === 0 ? { ...x, supersedes: list[i - 1].id } : x));
        const forward = ids(currentReadings(linked as R[]));
        const backward = ids(currentReadings([...linked].reverse() as R[]));
        expect(backward).toEqual(forward);
      }),
    );
  });
});
