// Selection checked against hand arithmetic. The inch shelf is common practice: a standard rod
// shell of 0.0745 in wall, a set 0.001 in thicker (0.0750 in a half) and an extra-clearance set
// 0.001 in thinner (0.0740 in a half); a half from the thicker set tightens a journal by 0.0005 in.
import { describe, expect, it } from "vitest";
import { selectShells, type SelectionInput } from "@/lib/domain";
import { journal, shellSet, window } from "./shelf";

const BORE = 2.25; // rod big end, measured without shells, vertical to the parting line
const rodShelf = (plus = 8, minus = 8) => [
  shellSet("std", { kind: "standard" }, 8, { thickness: 0.0745 }),
  shellSet("plus", { kind: "thicker", amount: 0.001 }, plus),
  shellSet("minus", { kind: "thinner", amount: 0.001 }, minus),
];
const rodWindow = { rod: window(0.002, 0.0025, 0.00225) };

describe("selectShells, inch rods (common practice arithmetic)", () => {
  const input: SelectionInput = {
    journals: [
      journal("rod 1", 2.0988, BORE), // standard pair: 2.25 − 0.149 − 2.0988 = 0.0022
      journal("rod 2", 2.0982, BORE), // standard 0.0028 (loose); one thicker half → 0.0023
      journal("rod 3", 2.0993, BORE), // standard 0.0017 (tight); one thinner half → 0.0022
    ],
    sets: rodShelf(),
    windows: rodWindow,
  };

  it("keeps a journal that lands near the target on one set", () => {
    const r = selectShells(input).results[0];
    expect(r).toMatchObject({ clearance: 0.0022, mixed: false, inWindow: true, verdict: "in_spec" });
    expect([r.upper?.setId, r.lower?.setId]).toEqual(["std", "std"]);
  });

  it("tightens a loose journal with one thicker half, on the rod side", () => {
    const r = selectShells(input).results[1];
    expect(r.clearance).toBe(0.0023);
    expect([r.upper?.setId, r.lower?.setId]).toEqual(["plus", "std"]);
    expect(r.upper?.wall).toBe(0.075);
    expect(r.mixed).toBe(true);
  });

  it("loosens a tight journal with one thinner half, the thicker half still on the rod side", () => {
    const r = selectShells(input).results[2];
    expect(r.clearance).toBe(0.0022);
    expect([r.upper?.setId, r.lower?.setId]).toEqual(["std", "minus"]);
  });

  it("counts the halves used and left", () => {
    const s = selectShells(input);
    expect(s.stock).toEqual([
      { setId: "std", used: { upper: 2, lower: 2 }, left: { upper: 6, lower: 6 } },
      { setId: "plus", used: { upper: 1, lower: 0 }, left: { upper: 7, lower: 8 } },
      { setId: "minus", used: { upper: 0, lower: 1 }, left: { upper: 8, lower: 7 } },
    ]);
    expect(s.allInWindow).toBe(true);
    expect(s.advice).toEqual([]);
  });

  it("prefers the unmixed pair when a mixed one is no nearer the target", () => {
    // 2.0985: standard 0.0025 and one thicker half 0.0020 are both 0.00025 from the target.
    const s = selectShells({ ...input, journals: [journal("rod 1", 2.0985, BORE)] });
    expect(s.results[0]).toMatchObject({ clearance: 0.0025, mixed: false });
  });

  // Largest by default: a published fitting procedure measures the journal for its maximum diameter
  // before picking inserts (Dodge Durango 5.7L service information, Crankshaft Main Bearing, Main
  // Bearing Selection: "Determine the maximum diameter of the journal").
  it("uses the largest journal diameter by default, the smallest when asked", () => {
    const j = [journal("rod 1", [2.0986, 2.0988, 2.0987], BORE)];
    expect(selectShells({ ...input, journals: j }).results[0]).toMatchObject({
      clearance: 0.0022,
      journalDiameter: 2.0988,
    });
    const loosest = selectShells({ ...input, journals: j, journalFigure: "smallest" }).results[0];
    expect(loosest).toMatchObject({ clearance: 0.0024, journalDiameter: 2.0986 });
  });

  it("shows the prediction's expanded uncertainty from the gauges' U (JCGM 100:2008, eq. 10)", () => {
    const j = [journal("rod 1", 2.0988, BORE, { journalU: 0.0001, housingU: 0.00008 })];
    const r = selectShells({ ...input, journals: j }).results[0];
    // u = 0.00005 and 0.00004 → u_c = 0.0000640…, U = 2·u_c = 0.000128…
    expect(r.uncertainty).toBeCloseTo(2 * Math.hypot(0.00005, 0.00004), 12);
  });

  it("never takes more halves than on hand, and says which set ran out", () => {
    const two = [journal("rod 1", 2.0982, BORE), journal("rod 2", 2.0982, BORE)];
    const s = selectShells({ ...input, journals: two, sets: rodShelf(1, 8) });
    expect(s.results.map((r) => r.upper?.setId)).toEqual(["plus", "std"]);
    expect(s.results[1]).toMatchObject({ clearance: 0.0028, inWindow: false });
    expect(s.advice).toEqual([{ key: "rod 2", unit: "in", kind: "more_stock", setId: "plus" }]);
  });
});

describe("selectShells, undersize and measured shells (common practice arithmetic)", () => {
  it("fits a journal ground 0.010 in under with the undersize set, whose walls are 0.005 in thicker", () => {
    const sets = [...rodShelf(), shellSet("us10", { kind: "undersize", amount: 0.01 }, 2)];
    // 2.25 − 2 × 0.0795 − 2.0888 = 0.0022; a standard half would be 0.005 in thinner and never mixes.
    const s = selectShells({ journals: [journal("rod 1", 2.0888, BORE)], sets, windows: rodWindow });
    expect(s.results[0]).toMatchObject({ clearance: 0.0022, mixed: false, upper: { setId: "us10", wall: 0.0795 } });
  });

  it("takes each half's measured wall and the ball micrometer's U", () => {
    const measured = shellSet("std", { kind: "standard" }, 2);
    measured.wall = { source: "measured", upper: 0.0746, lower: 0.0744, gaugeU: 0.0001 };
    const j = journal("rod 1", 2.0988, BORE, { journalU: 0.0001, housingU: 0.0001 });
    const r = selectShells({ journals: [j], sets: [measured], windows: rodWindow }).results[0];
    // 2.25 − 0.0746 − 0.0744 − 2.0988 = 0.0022; four inputs of u = 0.00005 → U = 2 · 0.0001 = 0.0002.
    expect(r).toMatchObject({ clearance: 0.0022, upper: { wall: 0.0746 }, lower: { wall: 0.0744 } });
    expect(r.uncertainty).toBeCloseTo(0.0002, 12);
  });

  it("judges a journal against its own window when it has one", () => {
    const own = journal("rod 1", 2.0988, BORE, { window: window(0.0024, 0.003, 0.0027) });
    const s = selectShells({ journals: [own, journal("rod 2", 2.0988, BORE)], sets: rodShelf(), windows: rodWindow });
    expect(s.results.map((r) => r.clearance)).toEqual([0.0027, 0.0022]);
  });
});

describe("selectShells, mm and inch together", () => {
  it("works in the window's unit, with journals in mm and shells in inch (1 in = 25.4 mm exactly)", () => {
    // The rod-1 case above in mm: 57.15 − 2 × 1.8923 − 53.30952 = 0.05588 mm (= 0.0022 in).
    const s = selectShells({
      journals: [journal("rod 1", 53.30952, 57.15, { unit: "mm" })],
      sets: rodShelf(),
      windows: { rod: window(0.0508, 0.0635, 0.05715, "mm") },
    });
    expect(s.results[0]).toMatchObject({ clearance: 0.05588, unit: "mm", mixed: false });
    expect(s.results[0].upper?.wall).toBe(1.8923);
  });
});

describe("selectShells, thrust main from another series", () => {
  it("fits the thrust journal from its own series and never mixes it with the mains' shells", () => {
    const sets = [
      shellSet("main std", { kind: "standard" }, 10, { role: "main", series: "A", thickness: 0.0985 }),
      shellSet("main plus", { kind: "thicker", amount: 0.001 }, 10, { role: "main", series: "A" }),
      shellSet("thrust std", { kind: "standard" }, 1, { role: "thrust", series: "B", thickness: 0.0988 }),
    ];
    const mains = { main: window(0.002, 0.003, 0.0025) };
    const s = selectShells({
      journals: [
        journal("main 1", 2.4475, 2.6465, { role: "main" }), // 2.6465 − 0.197 − 2.4475 = 0.0020
        journal("main 2", 2.447, 2.6465, { role: "thrust" }), // 2.6465 − 0.1976 − 2.447 = 0.0019
      ],
      sets,
      windows: mains,
    });
    expect(s.results[0]).toMatchObject({
      clearance: 0.002,
      upper: { setId: "main std" },
      lower: { setId: "main std" },
    });
    expect(s.results[1]).toMatchObject({ clearance: 0.0019, inWindow: false, upper: { series: "B" } });
    // The thrust journal cannot reach: thinner thrust shells would (0.0025 − 0.0019 = 0.0006).
    expect(s.advice).toEqual([
      { key: "main 2", unit: "in", kind: "order_thinner", nearest: 0.0019, miss: -0.0001, amount: 0.0006 },
    ]);
  });
});

describe("selectShells, advice when the window cannot be reached", () => {
  const one = (d: number) =>
    selectShells({ journals: [journal("rod 1", d, BORE)], sets: rodShelf(), windows: rodWindow });

  it("loose by a little: order a thicker set", () => {
    // Standard 0.0040; the nearest is both halves thicker: 0.0030, 0.0005 loose; 0.00075 from the target.
    const s = one(2.097);
    expect(s.results[0]).toMatchObject({ clearance: 0.003, upper: { setId: "plus" }, lower: { setId: "plus" } });
    expect(s.advice).toEqual([
      { key: "rod 1", unit: "in", kind: "order_thicker", nearest: 0.003, miss: 0.0005, amount: 0.0008 },
    ]);
  });

  it("tight by a little: order an extra-clearance set", () => {
    // Standard 0.0005; both halves thinner: 0.0015, 0.0005 tight.
    expect(one(2.1005).advice[0]).toMatchObject({
      kind: "order_thinner",
      nearest: 0.0015,
      miss: -0.0005,
      amount: 0.0008,
    });
  });

  it("loose beyond what an adjusting set makes up: grind undersize", () => {
    // Standard 0.0080; the nearest 0.0070 is 0.00475 from the target, beyond 0.002 in.
    const a = one(2.093).advice[0];
    expect(a).toMatchObject({ kind: "grind_undersize", nearest: 0.007, miss: 0.0045 });
    expect(a.amount).toBeUndefined();
  });

  it("no shells for the journal's role", () => {
    const s = selectShells({
      journals: [journal("main 1", 2.4475, 2.6465, { role: "main" })],
      sets: rodShelf(),
      windows: { main: window(0.002, 0.003, 0.0025) },
    });
    expect(s.results[0]).toMatchObject({ key: "main 1", inWindow: false, mixed: false });
    expect(s.results[0].upper).toBeUndefined();
    expect(s.advice).toEqual([{ key: "main 1", unit: "in", kind: "no_shells" }]);
  });
});

describe("selectShells, refusals in words", () => {
  it("names what to fix", () => {
    const base: SelectionInput = { journals: [journal("rod 1", 2.0988, BORE)], sets: rodShelf(), windows: rodWindow };
    expect(() => selectShells({ ...base, windows: {} })).toThrow(/Enter the rod bearing clearance window/);
    expect(() => selectShells({ ...base, journals: [...base.journals, ...base.journals] })).toThrow(
      /Two journals are named rod 1/,
    );
    const noWall = [shellSet("plus", { kind: "thicker", amount: 0.001 }, 2)];
    expect(() => selectShells({ ...base, sets: noWall })).toThrow(/has no wall thickness/);
    const noAmount = [...rodShelf(), shellSet("x", { kind: "thicker" }, 2)];
    expect(() => selectShells({ ...base, sets: noAmount })).toThrow(/needs its amount/);
    const half = [shellSet("std", { kind: "standard" }, 1.5, { thickness: 0.0745 })];
    expect(() => selectShells({ ...base, sets: half })).toThrow(/whole numbers/);
    expect(() => selectShells({ ...base, windows: { rod: window(0.003, 0.002, 0.0025) } })).toThrow(/swap them/);
    expect(() => selectShells({ ...base, journals: [journal("rod 1", [], BORE)] })).toThrow(
      /at least one measured diameter/,
    );
  });
});
