import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { deriveReadings, evaluateReading } from "../../../lib/domain/derive";
import type { DerivedValue, EngineShape, RawReading, SpecLimit } from "../../../lib/domain/types";

interface Q {
  value: number | number[];
}
const cases = JSON.parse(readFileSync(new URL("./fixtures/check-values.json", import.meta.url), "utf8")) as {
  id: string;
  inputs: Record<string, Q>;
  expected: Record<string, Q>;
  abs_tol?: number;
}[];
const check = (id: string) => cases.find((c) => c.id === id)!;
const num = (q: Q) => q.value as number;
const nums = (q: Q) => q.value as number[];

const v8: EngineShape = { cylinders: 8, layout: "v", mains: 5, valvesPerCylinder: 2, unitSystem: "inch" };
const at = (stationId: string, value: number, extra: Partial<RawReading> = {}): RawReading => ({
  stationId,
  value,
  unit: "in",
  ...extra,
});
const limit = (l: Partial<SpecLimit> & Pick<SpecLimit, "characteristic">): SpecLimit => ({
  stationPattern: "*",
  limitType: "max_only",
  unit: "in",
  required: true,
  ...l,
});
const pick = (values: DerivedValue[], key: string) => {
  const found = values.find((d) => d.key === key);
  if (!found) throw new Error(`no derived value ${key}`);
  return found;
};

/** P06 bore readings on cylinder 1: thrust axis A and pin axis B, top / mid / bottom. */
function p06Bore(): RawReading[] {
  const c = check("P06");
  const depths = ["top", "mid", "bottom"];
  return [
    ...nums(c.inputs.axis_A_thrust).map((v, i) => at(`bore/1/${depths[i]}/A`, v)),
    ...nums(c.inputs.axis_B_pin).map((v, i) => at(`bore/1/${depths[i]}/B`, v)),
  ];
}

describe("derived values from the shared check values", () => {
  it("P06: bore taper 0.0010 and out-of-round 0.0008 (common practice definitions) — exactly on a 0.0010 max is in spec", () => {
    const spec = [
      limit({ characteristic: "bore_taper", max: 0.001 }),
      limit({ characteristic: "bore_out_of_round", max: 0.0005 }),
    ];
    const d = deriveReadings(p06Bore(), v8, spec);
    const taper = pick(d, "bore_taper@bore/1");
    expect(taper).toMatchObject({ value: num(check("P06").expected.taper), verdict: "in_spec", missing: [] });
    expect(pick(d, "bore_out_of_round@bore/1")).toMatchObject({
      value: num(check("P06").expected.oor),
      verdict: "out_of_spec",
    });
    expect(taper.inputs).toHaveLength(6);
  });
  it("P07: main journal taper 0.0003 and out-of-round 0.0002 (common practice)", () => {
    const c = check("P07");
    const [aF, aR] = nums(c.inputs.axis_A);
    const [bF, bR] = nums(c.inputs.axis_B_90deg);
    const readings = [
      at("main/3/front/A", aF),
      at("main/3/rear/A", aR),
      at("main/3/front/B", bF),
      at("main/3/rear/B", bR),
    ];
    const d = deriveReadings(readings, v8, []);
    expect(pick(d, "main_journal_taper@main/3").value).toBe(num(c.expected.taper));
    expect(pick(d, "main_journal_out_of_round@main/3").value).toBe(num(c.expected.oor));
    expect(pick(d, "main_journal_taper@main/3").note).toMatch(/no limit/);
  });
  it("P08: main oil clearance 2.1010 − 2.0988 = 0.0022 at the matching position and axis (common practice)", () => {
    const c = check("P08");
    const readings = [
      at("main-brg/2/front/A", num(c.inputs.bearing_id_installed)),
      at("main/2/front/A", num(c.inputs.journal_od)),
    ];
    const v = pick(deriveReadings(readings, v8, []), "main_oil_clearance@main-brg/2/front/A");
    expect(v.value).toBe(num(c.expected.oil_clearance));
    expect(v.inputs).toEqual(["main-brg/2/front/A", "main/2/front/A"]);
  });
  it("P08 rule: 0.001 in per inch of the measured journal gives a 0.0020988 in max, so 0.0022 is out (common practice)", () => {
    const c = check("P08");
    const spec = [limit({ characteristic: "main_oil_clearance", limitType: "per_inch", perInchMax: 0.001 })];
    const readings = [at("main-brg/2/front/A", 2.101), at("main/2/front/A", 2.0988)];
    const v = pick(deriveReadings(readings, v8, spec), "main_oil_clearance@main-brg/2/front/A");
    expect(v.limits?.max).toBe(num(c.expected.rule_of_thumb_clearance));
    expect(v.verdict).toBe("out_of_spec");
  });
  it("P09: piston-to-wall from the bore at mid depth, thrust axis, and the skirt: 4.0305 − 4.0280 = 0.0025 (common practice)", () => {
    const c = check("P09");
    expect(num(c.inputs.bore)).toBe(nums(check("P06").inputs.axis_A_thrust)[1]); // P06 mid-depth thrust reading
    const readings = [...p06Bore(), at("skirt/1", num(c.inputs.piston_skirt))];
    const v = pick(deriveReadings(readings, v8, []), "piston_to_wall@bore/1");
    expect(v.value).toBe(num(c.expected.clearance));
    expect(v.inputs).toEqual(["bore/1/mid/A", "skirt/1"]);
  });
  it("P11: rod bolt stretch 2.0062 − 2.0005 = 0.0057 (common practice)", () => {
    const c = check("P11");
    const readings = [
      at("bolt/4/2/free", num(c.inputs.free_length)),
      at("bolt/4/2/loaded", num(c.inputs.loaded_length)),
    ];
    const spec = [limit({ characteristic: "rod_bolt_stretch", limitType: "min_max", min: 0.0055, max: 0.0065 })];
    expect(pick(deriveReadings(readings, v8, spec), "rod_bolt_stretch@bolt/4/2")).toMatchObject({
      value: num(c.expected.stretch),
      verdict: "in_spec",
    });
  });
});

describe("exact at the limit through derivation", () => {
  it("0.001 in per inch on a 2.200 in rod journal is 0.0022 in; 2.2022 − 2.2000 sits on it and is in spec (common practice)", () => {
    const spec = [
      limit({ characteristic: "rod_oil_clearance", limitType: "per_inch", perInchMin: 0.00075, perInchMax: 0.001 }),
    ];
    const readings = [at("rod-brg/2/front/B", 2.2022), at("rod/1/front/B", 2.2)]; // V8: rod 2 runs on crankpin 1
    const v = pick(deriveReadings(readings, v8, spec), "rod_oil_clearance@rod-brg/2/front/B");
    expect(v).toMatchObject({
      value: 0.0022,
      limits: { unit: "in", min: 0.00165, max: 0.0022 },
      verdict: "in_spec",
      inputs: ["rod-brg/2/front/B", "rod/1/front/B"],
    });
  });
  it("metric: 55.946 − 55.880 = 0.066 mm on a 0.066 mm max is in spec", () => {
    const metric: EngineShape = { ...v8, unitSystem: "metric" };
    const spec = [
      limit({ characteristic: "main_oil_clearance", limitType: "min_max", unit: "mm", min: 0.03, max: 0.066 }),
    ];
    const readings = [
      { stationId: "main-brg/1/rear/A", value: 55.946, unit: "mm" as const },
      { stationId: "main/1/rear/A", value: 55.88, unit: "mm" as const },
    ];
    expect(pick(deriveReadings(readings, metric, spec), "main_oil_clearance@main-brg/1/rear/A")).toMatchObject({
      value: 0.066,
      unit: "mm",
      verdict: "in_spec",
    });
  });
});

describe("uncertainty, guard band and units", () => {
  it("combines the two readings' U as a difference (JCGM 100:2008 eq. 10, c = ±1) and guard-bands the verdict", () => {
    const spec = [limit({ characteristic: "main_oil_clearance", limitType: "min_max", min: 0.0015, max: 0.0025 })];
    const readings = [
      at("main-brg/1/front/A", 2.5024, { uncertainty: 0.0001 }),
      at("main/1/front/A", 2.5, { uncertainty: 0.0001 }),
    ];
    const v = pick(deriveReadings(readings, v8, spec), "main_oil_clearance@main-brg/1/front/A");
    expect(v.uncertainty).toBeCloseTo(Math.hypot(0.0001, 0.0001), 12); // U = 2·√((U1/2)² + (U2/2)²)
    expect(v.verdict).toBe("marginal"); // 0.0024 is within 0.000141 of 0.0025
    const noU = pick(
      deriveReadings(
        readings.map(({ uncertainty: _u, ...r }) => r),
        v8,
        spec,
      ),
      v.key,
    );
    expect(noU.verdict).toBe("in_spec");
    expect(noU.uncertainty).toBeUndefined();
  });
  it("a journal measured in mm on an inch job is converted before the difference (NIST SP 811 B.8)", () => {
    const readings = [
      at("main-brg/1/front/A", 2.201),
      { stationId: "main/1/front/A", value: 55.88, unit: "mm" as const },
    ];
    expect(pick(deriveReadings(readings, v8, []), "main_oil_clearance@main-brg/1/front/A")).toMatchObject({
      value: 0.001,
      unit: "in",
    });
  });
  it("reports the value in the limit's unit when the spec is metric and the job inch", () => {
    const spec = [limit({ characteristic: "main_oil_clearance", limitType: "max_only", unit: "mm", max: 0.0254 })];
    const readings = [at("main-brg/1/front/A", 2.201), at("main/1/front/A", 2.2)];
    expect(pick(deriveReadings(readings, v8, spec), "main_oil_clearance@main-brg/1/front/A")).toMatchObject({
      value: 0.0254,
      unit: "mm",
      verdict: "in_spec",
    });
  });
});

describe("corrections to 20 °C (ISO 1; check values P21, P22)", () => {
  const alu: EngineShape = { ...v8, materials: { block: "aluminium356" } };
  it("P22: part only, 4.0000 in of 356.0 aluminium at 30 °C is 3.9991402 in at 20 °C", () => {
    const c = check("P22");
    const e = evaluateReading(at("bore/1/top/A", 4, { temperatureC: 30 }), alu, []);
    expect(Math.abs(e.value - num(c.expected.L20))).toBeLessThanOrEqual(c.abs_tol!);
    expect(e.correction).toMatchObject({
      stationId: "bore/1/top/A",
      measured: 4,
      partTempC: 30,
      alphaPart: 21.5e-6,
      material: "aluminium356",
    });
  });
  it("P21: gauge at 30 °C too (steel master), 3.9996001 in; the reading's own material (grey iron) overrides", () => {
    const c = check("P21");
    const both = evaluateReading(at("bore/1/top/A", 4, { temperatureC: 30, gaugeTemperatureC: 30 }), alu, []);
    expect(Math.abs(both.value - num(c.expected.L20))).toBeLessThanOrEqual(c.abs_tol!);
    const iron = evaluateReading(
      at("bore/1/top/A", 4, { temperatureC: 30, gaugeTemperatureC: 30, material: "greyCastIron" }),
      alu,
      [],
    );
    expect(Math.abs(iron.value - num(c.expected.b_L20))).toBeLessThanOrEqual(c.abs_tol!);
  });
  it("corrects each input before a difference and lists the corrections", () => {
    const readings = [at("bore/2/mid/A", 4, { temperatureC: 30 }), at("skirt/2", 3.997)];
    const v = pick(deriveReadings(readings, alu, []), "piston_to_wall@bore/2");
    expect(v.value).toBeCloseTo(3.9991402 - 3.997, 6); // P22 bore, skirt already at 20 °C
    expect(v.corrections?.map((k) => k.stationId)).toEqual(["bore/2/mid/A"]);
  });
  it("says so, and does not guess, when the material is unknown", () => {
    const e = evaluateReading(at("bore/1/top/A", 4, { temperatureC: 30 }), v8, []);
    expect(e.value).toBe(4);
    expect(e.note).toMatch(/no block material is set/);
  });
});

describe("missing and superseded inputs", () => {
  it("lists the inputs still missing and gives the limits without a value", () => {
    const spec = [limit({ characteristic: "bore_taper", max: 0.001 })];
    const v = pick(deriveReadings([at("bore/5/top/A", 4.03)], v8, spec), "bore_taper@bore/5");
    expect(v.missing).toEqual(["bore/5/mid/A", "bore/5/bottom/A", "bore/5/top/B", "bore/5/mid/B", "bore/5/bottom/B"]);
    expect(v.value).toBeUndefined();
    expect(v.verdict).toBeUndefined();
    expect(v.limits).toEqual({ unit: "in", max: 0.001 });
  });
  it("gives every derived value of a V8 (24 per bores, 10 mains, 8 crankpins, 20 + 32 oil clearances, 16 bolts)", () => {
    const all = deriveReadings([], v8, []);
    expect(all).toHaveLength(110);
    expect(new Set(all.map((d) => d.key)).size).toBe(110);
    expect(all.every((d) => d.missing.length === d.inputs.length && d.value === undefined)).toBe(true);
  });
  it("with `touching`, gives exactly the values a full pass gives for those stations, and only them", () => {
    // Invented figures (not reference values): every station of every derived value, so nothing is missing.
    const stations = [...new Set(deriveReadings([], v8, []).flatMap((d) => d.inputs))];
    const readings = stations.map((id, i) =>
      at(
        id,
        id.startsWith("bolt/") ? 2 + (i % 3) * 0.0002 + (id.endsWith("loaded") ? 0.006 : 0) : 4.03 + (i % 7) * 0.0001,
      ),
    );
    const spec = [
      limit({ characteristic: "bore_taper", max: 0.0005 }),
      limit({ characteristic: "rod_bolt_stretch", limitType: "min_max", min: 0.005, max: 0.007 }),
    ];
    const full = deriveReadings(readings, v8, spec);
    for (const touching of [
      (s: string) => s.startsWith("bore/3/"),
      (s: string) => s === "bolt/2/1/loaded",
      (s: string) => s.startsWith("main-brg/4/"),
    ]) {
      const some = deriveReadings(readings, v8, spec, { touching });
      expect(some.length).toBeGreaterThan(0);
      expect(some).toEqual(full.filter((d) => d.inputs.some(touching)));
    }
  });
  it("with `characteristics`, gives exactly the values a full pass gives of those characteristics", () => {
    // Invented figures (not reference values), one per station; a spec with a limit on one of each kind.
    const stations = [...new Set(deriveReadings([], v8, []).flatMap((d) => d.inputs))];
    const readings = stations.map((id, i) =>
      at(id, id.startsWith("bolt/") ? 2 + (id.endsWith("loaded") ? 0.006 : 0) : 4.03 + (i % 5) * 0.0001),
    );
    const spec = [limit({ characteristic: "bore_taper", max: 0.0005 })];
    const full = deriveReadings(readings, v8, spec);
    const only = ["bore_taper", "rod_journal_out_of_round"] as const;
    const some = deriveReadings(readings, v8, spec, { characteristics: only });
    expect(some).toHaveLength(8 + 4);
    expect(some).toEqual(full.filter((d) => (only as readonly string[]).includes(d.characteristic)));
  });
  it("uses the latest reading of a station, by takenAt, whatever the list order", () => {
    const readings = [
      at("bolt/1/1/loaded", 2.0062, { takenAt: "2026-03-02T10:05:00Z" }),
      at("bolt/1/1/loaded", 2.0071, { takenAt: "2026-03-02T10:00:00Z" }),
      at("bolt/1/1/free", 2.0005),
    ];
    expect(pick(deriveReadings(readings, v8, []), "rod_bolt_stretch@bolt/1/1").value).toBe(0.0057);
  });
  it("treats an unusable reading as missing and says why", () => {
    const v = pick(
      deriveReadings([at("bolt/1/1/free", -2), at("bolt/1/1/loaded", 2.0062)], v8, []),
      "rod_bolt_stretch@bolt/1/1",
    );
    expect(v.missing).toEqual(["bolt/1/1/free"]);
    expect(v.note).toMatch(/not usable: .*above zero/);
  });
  it("a later reading never loses to an earlier one, in any order (fast-check)", () => {
    fc.assert(
      fc.property(fc.shuffledSubarray([0, 1, 2, 3], { minLength: 4, maxLength: 4 }), (order) => {
        const readings = order.map((i) =>
          at("bolt/2/1/loaded", 2.006 + i / 10000, { takenAt: `2026-03-02T10:0${i}:00Z` }),
        );
        const value = pick(
          deriveReadings([...readings, at("bolt/2/1/free", 2)], v8, []),
          "rod_bolt_stretch@bolt/2/1",
        ).value;
        return value === 0.0063;
      }),
    );
  });
});

describe("evaluateReading", () => {
  const withSizes: EngineShape = { ...v8, nominalSizes: { bore: 4.03 } };
  const ringRule = [
    limit({
      characteristic: "ring_end_gap",
      stationPattern: "ring-gap/*/top",
      limitType: "per_inch",
      perInchMin: 0.0045,
    }),
  ];
  it("gives verdict, limits and deviation from nominal", () => {
    const spec = [
      limit({ characteristic: "bore_diameter", limitType: "nominal_tol", nominal: 4.03, tolPlus: 0.001, tolMinus: 0 }),
    ];
    expect(evaluateReading(at("bore/1/top/A", 4.0303), v8, spec)).toEqual({
      verdict: "in_spec",
      limits: { unit: "in", nominal: 4.03, min: 4.03, max: 4.031 },
      value: 4.0303,
      unit: "in",
      deviation: 0.0003,
    });
    expect(evaluateReading(at("bore/1/top/A", 4.0311), v8, spec).verdict).toBe("out_of_spec");
  });
  it("P26: a ring-gap rule takes the bore from the job's readings, else the nominal bore (common practice)", () => {
    const bores = [1, 2].flatMap(() =>
      ["top", "mid", "bottom"].flatMap((d) => ["A", "B"].map((a) => at(`bore/3/${d}/${a}`, 4.03))),
    );
    const e = evaluateReading(at("ring-gap/3/top", 0.018), v8, ringRule, bores);
    expect(e.limits).toEqual({ unit: "in", min: num(check("P26").expected.top_ring_gap_min) });
    expect(e.verdict).toBe("out_of_spec");
    expect(evaluateReading(at("ring-gap/3/top", 0.0182), withSizes, ringRule).verdict).toBe("in_spec");
  });
  it("gives a note, not a verdict, when a rule has nothing to scale with", () => {
    const e = evaluateReading(at("ring-gap/3/top", 0.018), v8, ringRule);
    expect(e.verdict).toBeUndefined();
    expect(e.note).toMatch(/needs that diameter/);
  });
  it("ISO 286 g6 on a metric main journal from the engine's nominal size (ISO 286-2:2010, g6 30–50 mm: −9/−25 µm)", () => {
    const metric: EngineShape = { ...v8, unitSystem: "metric", nominalSizes: { mainJournal: 50 } };
    const spec = [limit({ characteristic: "main_journal_diameter", limitType: "iso286", unit: "mm", isoClass: "g6" })];
    const mm = (v: number): RawReading => ({ stationId: "main/1/front/A", value: v, unit: "mm" });
    expect(evaluateReading(mm(49.991), metric, spec)).toMatchObject({ verdict: "in_spec", deviation: -0.009 });
    expect(evaluateReading(mm(49.992), metric, spec).verdict).toBe("out_of_spec");
  });
  it("checks a torque entry, which needs its lubricant (100 lbf·ft = 135.6 N·m, common practice)", () => {
    const spec = [
      limit({
        characteristic: "fastener_torque",
        stationPattern: "torque/main-caps",
        limitType: "min_max",
        unit: "nm",
        min: 135,
        max: 136,
      }),
    ];
    const r: RawReading = { stationId: "torque/main-caps", value: 100, unit: "lbf_ft", lubricant: "moly-paste" };
    expect(evaluateReading(r, v8, spec)).toMatchObject({ verdict: "in_spec", unit: "nm" });
    expect(() => evaluateReading({ ...r, lubricant: undefined }, v8, spec)).toThrow(/which lubricant/);
  });
  it.each([
    [at("bore/9/top/A", 4.03), /not on this engine's route/],
    [at("bore/1", 4.03), /names a part/],
    [at("bore/1/top/C", 4.03), /axis must be A \| B/],
    [at("torque/main-caps", 65), /^Torque · main caps takes a torque in lbf·ft or N·m/],
    [{ stationId: "bore/1/top/A", value: 4.03, unit: "lbf_ft" as const }, /takes a length in in or mm/],
    [at("bore/1/top/A", 0), /above zero/],
    [at("bore/1/top/A", Number.NaN), /must be a number/],
    [at("side/1", -0.001), /zero or more/],
    [at("bore/1/top/A", 4.03, { uncertainty: -1 }), /uncertainty U must be zero or more/],
  ])("refuses bad input %#", (reading, message) => {
    expect(() => evaluateReading(reading, v8, [])).toThrow(message);
  });
  it("accepts a zero gap", () => {
    expect(
      evaluateReading(at("side/1", 0), v8, [
        limit({ characteristic: "rod_side_clearance", limitType: "min_only", min: 0.01 }),
      ]).verdict,
    ).toBe("out_of_spec");
  });
});
