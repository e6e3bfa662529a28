import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  benchRoute,
  deriveReadings,
  derivedInputs,
  limitInputs,
  onSamePart,
  partOf,
  readingReach,
  type EngineShape,
} from "../../../lib/domain";

// What a new reading can change, from the core's recipes and limits. The engines are invented
// shapes; the rules checked are the core's own (derive.ts recipes, a ring gap's limit read per inch
// of its bore: common practice, from memory).
const v8: EngineShape = { cylinders: 8, layout: "v", mains: 5, valvesPerCylinder: 2, unitSystem: "inch" };
const inline4: EngineShape = { cylinders: 4, layout: "inline", mains: 5, valvesPerCylinder: 4, unitSystem: "metric" };
const route = (e: EngineShape) => benchRoute(e).sections.flatMap((s) => s.stations.map((st) => st.id));
const sorted = (s: Iterable<string>) => [...s].sort();

describe("the part a station is on", () => {
  it.each([
    ["bore/3/top/A", "bore/3"],
    ["main/2/front/B", "main/2"],
    ["rod/4/rear/A", "rod/4"],
    ["main-brg/5/rear/B", "main-brg/5"],
    ["bolt/2/1/free", "bolt/2/1"],
    ["skirt/6", "skirt/6"],
    ["ring-gap/1/oil", "ring-gap/1"],
    ["deck/left/front", "deck/left"],
    ["end-play", "end-play"],
    ["torque/main-caps", "torque/main-caps"],
    ["bore/3", "bore/3"],
  ])("%s is on %s", (id, part) => expect(partOf(id)).toBe(part));
  it("refuses an id the grammar does not know, saying why", () => {
    expect(() => partOf("crank/1")).toThrow(/'crank' is not a section/);
  });
  it("puts bolt 1 and bolt 2 of a rod on different parts, a bore's twelve stations on one", () => {
    expect(onSamePart("bolt/2/1/free")("bolt/2/1/loaded")).toBe(true);
    expect(onSamePart("bolt/2/1/free")("bolt/2/2/free")).toBe(false);
    expect(route(v8).filter(onSamePart("bore/3/mid/B"))).toHaveLength(6);
  });
});

describe("what the limit of a station reads", () => {
  it("a ring gap reads its own cylinder's six bore stations; every other station nothing", () => {
    expect(sorted(limitInputs("ring-gap/3/top"))).toEqual(sorted(route(v8).filter((id) => partOf(id) === "bore/3")));
    for (const id of route(v8).filter((s) => !s.startsWith("ring-gap/"))) expect(limitInputs(id)).toEqual([]);
  });
});

describe("what new readings reach", () => {
  it("a bore station: its bore's taper and out-of-round, its cylinder's ring gaps judged again", () => {
    const r = readingReach(v8, ["bore/1/top/A"]);
    expect(sorted(r.derived)).toEqual(["bore_out_of_round@bore/1", "bore_taper@bore/1"]);
    expect(sorted(r.rejudge)).toEqual(["ring-gap/1/oil", "ring-gap/1/second", "ring-gap/1/top"]);
    const cylinder1 = route(v8).filter((id) => partOf(id) === "bore/1" || partOf(id) === "ring-gap/1");
    expect(sorted(r.reads)).toEqual(sorted(cylinder1));
  });
  it("bore mid A also feeds piston-to-wall, so the skirt is read", () => {
    const r = readingReach(v8, ["bore/1/mid/A"]);
    expect(r.derived.has("piston_to_wall@bore/1")).toBe(true);
    expect(r.reads.has("skirt/1")).toBe(true);
  });
  it("a main journal point: its journal's geometry and the oil clearance at that point", () => {
    const r = readingReach(v8, ["main/2/front/A"]);
    expect(sorted(r.derived)).toEqual([
      "main_journal_out_of_round@main/2",
      "main_journal_taper@main/2",
      "main_oil_clearance@main-brg/2/front/A",
    ]);
    expect(r.rejudge.size).toBe(0);
    expect(r.reads.has("main-brg/2/front/A")).toBe(true);
    expect([...r.reads].some((id) => id.startsWith("main-brg/2/rear") || partOf(id) === "main/1")).toBe(false);
  });
  it("a rod bearing on a V reads the crankpin its rod shares", () => {
    // Default V layout: rods 3 and 4 on crankpin 2.
    expect(readingReach(v8, ["rod-brg/4/front/A"]).reads.has("rod/2/front/A")).toBe(true);
  });
  it("a ring gap is judged again with its bore; a torque reaches nothing else", () => {
    const gap = readingReach(inline4, ["ring-gap/2/top"]);
    expect([...gap.rejudge]).toEqual(["ring-gap/2/top"]);
    expect(gap.reads.has("bore/2/bottom/B") && !gap.reads.has("ring-gap/2/second")).toBe(true);
    expect(readingReach(inline4, ["torque/main-caps"])).toEqual({
      derived: new Set(),
      rejudge: new Set(),
      reads: new Set(["torque/main-caps"]),
    });
  });
  it("names exactly the derived values the core computes for those stations, with all their inputs (fast-check)", () => {
    const ids = route(v8);
    fc.assert(
      fc.property(fc.subarray(ids, { maxLength: 6 }), (fresh) => {
        const touched = new Set(fresh);
        const r = readingReach(v8, fresh);
        const computed = deriveReadings([], v8, [], { touching: (s) => touched.has(s) });
        expect(sorted(r.derived)).toEqual(sorted(computed.map((d) => d.key)));
        for (const d of computed) for (const s of d.inputs) expect(r.reads.has(s)).toBe(true);
        for (const s of r.rejudge) for (const b of limitInputs(s)) expect(r.reads.has(b)).toBe(true);
      }),
      { numRuns: 200 },
    );
  });
  it("lists each derived value's inputs as the core's recipes have them", () => {
    const full = deriveReadings([], inline4, []);
    expect(new Map(full.map((d) => [d.key, d.inputs]))).toEqual(derivedInputs(inline4));
  });
});
