import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  DEFAULT_TORQUE_GROUPS,
  SECTION_ORDER,
  benchRoute,
  checkEngineShape,
  rodJournalCount,
  rodJournalOf,
} from "../../../lib/domain/bench-route";
import { describeStation } from "../../../lib/domain/station-words";
import { parseStationId } from "../../../lib/domain/stations";
import type { EngineShape } from "../../../lib/domain/types";

const v8: EngineShape = { cylinders: 8, layout: "v", mains: 5, valvesPerCylinder: 2, unitSystem: "inch" };
const i4: EngineShape = { cylinders: 4, layout: "inline", mains: 5, valvesPerCylinder: 4, unitSystem: "metric" };
const flat6: EngineShape = {
  cylinders: 6,
  layout: "flat",
  mains: 8,
  valvesPerCylinder: 2,
  unitSystem: "metric",
  ringsPerPiston: 3,
};

const counts = (e: EngineShape) => Object.fromEntries(benchRoute(e).sections.map((s) => [s.id, s.count]));

describe("a V8 with five mains", () => {
  const route = benchRoute(v8);
  it("lists every station a job needs, counted per section", () => {
    expect(counts(v8)).toEqual({
      bore: 48, // 8 cylinders × 3 depths × 2 axes
      deck: 4, // 2 banks × front and rear
      "main-brg": 20,
      main: 20, // 5 × 2 positions × 2 axes
      rod: 16, // 4 crankpins (two rods a pin) × 2 × 2
      bolt: 32, // 8 rods × 2 bolts × free and loaded
      "rod-brg": 32,
      skirt: 8,
      "ring-gap": 24,
      "end-play": 1,
      side: 8,
      torque: 5,
      lash: 16,
    });
    expect(route.total).toBe(234);
  });
  it("keeps bench order: sections in SECTION_ORDER, bores by cylinder then depth then axis", () => {
    expect(route.sections.map((s) => s.id)).toEqual(SECTION_ORDER);
    expect(route.sections[0].stations.slice(0, 7).map((s) => s.id)).toEqual([
      "bore/1/top/A",
      "bore/1/top/B",
      "bore/1/mid/A",
      "bore/1/mid/B",
      "bore/1/bottom/A",
      "bore/1/bottom/B",
      "bore/2/top/A",
    ]);
  });
  it("takes every bolt's free length before any torqued length", () => {
    const ids = route.sections.find((s) => s.id === "bolt")!.stations.map((s) => s.id);
    expect(ids.slice(0, 16).every((id) => id.endsWith("/free"))).toBe(true);
    expect(ids.slice(16).every((id) => id.endsWith("/loaded"))).toBe(true);
  });
  it("carries characteristic, unit, words, and a torque flag that only torque entries have", () => {
    const all = route.sections.flatMap((s) => s.stations);
    expect(new Set(all.map((s) => s.id)).size).toBe(all.length);
    for (const st of all) {
      expect(parseStationId(st.id).characteristic).toBe(st.characteristic);
      expect(st.label).toBe(describeStation(st.id));
      expect(st.torque).toBe(st.section === "torque");
      expect(st.unit).toBe(st.torque ? "lbf_ft" : "in");
    }
    expect(all.filter((s) => s.torque).map((s) => s.id)).toEqual(DEFAULT_TORQUE_GROUPS.map((g) => `torque/${g}`));
  });
  it("pairs rods on crankpins 1–2, 3–4… unless the engine gives its own map", () => {
    expect([1, 2, 3, 4, 5, 6, 7, 8].map((r) => rodJournalOf(v8, r))).toEqual([1, 1, 2, 2, 3, 3, 4, 4]);
    const byBank = { ...v8, rodJournalMap: [1, 2, 3, 4, 1, 2, 3, 4] }; // makers that number one bank, then the other
    expect(rodJournalOf(byBank, 5)).toBe(1);
  });
});

describe("other shapes", () => {
  it("an inline four with four valves: one deck, metric units, numbered valves", () => {
    const route = benchRoute(i4);
    expect(counts(i4)).toMatchObject({ bore: 24, deck: 2, main: 20, rod: 16, "rod-brg": 16, lash: 16 });
    const stations = route.sections.flatMap((s) => s.stations);
    expect(stations.find((s) => s.section === "deck")?.id).toBe("deck/block/front");
    expect(stations.filter((s) => s.id.startsWith("lash/1/")).map((s) => s.id)).toEqual([
      "lash/1/int1",
      "lash/1/int2",
      "lash/1/exh1",
      "lash/1/exh2",
    ]);
    expect(stations.find((s) => s.torque)?.unit).toBe("nm");
    expect(stations.find((s) => s.section === "bore")?.unit).toBe("mm");
  });
  it("a flat six: a crankpin per rod, a left and a right deck", () => {
    expect(rodJournalCount(flat6)).toBe(6);
    expect(counts(flat6)).toMatchObject({ rod: 24, deck: 4, main: 32 });
  });
  it("honours bolts per rod, rings per piston and the engine's own torque groups", () => {
    const e: EngineShape = {
      ...v8,
      boltsPerRod: 4,
      ringsPerPiston: 4,
      torqueGroups: ["main-caps", "main-cap-side-bolts"],
    };
    expect(counts(e)).toMatchObject({ bolt: 64, "ring-gap": 32, torque: 2 });
  });
  it("gives only the sections asked for, still in bench order", () => {
    const r = benchRoute(v8, ["lash", "bore"]);
    expect(r.sections.map((s) => s.id)).toEqual(["bore", "lash"]);
    expect(r.total).toBe(64);
    expect(() => benchRoute(v8, ["cams" as never])).toThrow(/Unknown section 'cams'/);
  });
});

describe("engine shapes that cannot be measured are refused with what to fix", () => {
  it.each([
    [{ ...v8, cylinders: 7 }, /even number of cylinders/],
    [{ ...v8, cylinders: 0 }, /Cylinders must be a whole number from 1 to 16/],
    [{ ...v8, cylinders: 2.5 }, /Cylinders must be a whole number/],
    [{ ...v8, layout: "w" }, /Layout must be inline, v or flat/],
    [{ ...v8, mains: 0 }, /Main bearings/],
    [{ ...v8, valvesPerCylinder: 1 }, /Valves per cylinder must be 2 to 5/],
    [{ ...v8, unitSystem: "imperial" }, /Unit system must be inch or metric/],
    [{ ...v8, boltsPerRod: 0 }, /Bolts per rod/],
    [{ ...v8, ringsPerPiston: 6 }, /Rings per piston/],
    [{ ...v8, rodJournals: 9 }, /Rod journals/],
    [{ ...v8, rodJournalMap: [1, 1, 2, 2] }, /one crankpin number per rod \(8\)/],
    [{ ...v8, rodJournalMap: [1, 1, 2, 2, 3, 3, 4, 5] }, /Crankpin of rod 8/],
    [{ ...v8, torqueGroups: ["Head Bolts"] }, /lower-case name/],
    [{ ...v8, materials: { block: "cheese" } }, /Unknown material 'cheese' for block/],
    [{ ...v8, nominalSizes: { bore: -4 } }, /Nominal bore size must be a number above zero/],
  ])("%#", (engine, message) => {
    expect(() => checkEngineShape(engine as EngineShape)).toThrow(message);
    expect(() => benchRoute(engine as EngineShape)).toThrow(message);
  });
});

describe("station count follows the engine shape (fast-check)", () => {
  const shape = fc.record({
    half: fc.integer({ min: 1, max: 8 }),
    layout: fc.constantFrom("inline" as const, "v" as const, "flat" as const),
    mains: fc.integer({ min: 1, max: 10 }),
    valves: fc.integer({ min: 2, max: 5 }),
    bolts: fc.integer({ min: 1, max: 4 }),
    rings: fc.integer({ min: 1, max: 4 }),
  });
  it("total = the sum of every per-part count, ids unique", () => {
    fc.assert(
      fc.property(shape, ({ half, layout, mains, valves, bolts, rings }) => {
        const c = half * 2;
        const e: EngineShape = {
          cylinders: c,
          layout,
          mains,
          valvesPerCylinder: valves,
          boltsPerRod: bolts,
          ringsPerPiston: rings,
          unitSystem: "inch",
        };
        const pins = layout === "v" ? c / 2 : c;
        const banks = layout === "inline" ? 1 : 2;
        const expected =
          c * 6 + banks * 2 + mains * 4 * 2 + pins * 4 + c * bolts * 2 + c * 4 + c + c * rings + 1 + c + 5 + c * valves;
        const route = benchRoute(e);
        const ids = route.sections.flatMap((s) => s.stations.map((st) => st.id));
        return route.total === expected && ids.length === expected && new Set(ids).size === expected;
      }),
    );
  });
});
