import { unit as mathUnit } from "mathjs";
import { describe, expect, it } from "vitest";
import { deriveReadings, evaluateReading } from "../../../lib/domain/derive";
import { limitContextFor, sizeChangeWords } from "../../../lib/domain/job-sizes";
import { limitsFor, resolveLimit } from "../../../lib/domain/limits";
import type { EngineShape, SpecLimit } from "../../../lib/domain/types";

const lim = (l: Partial<SpecLimit>): SpecLimit => ({
  characteristic: "bore_diameter",
  stationPattern: "*",
  limitType: "job_size_tol",
  unit: "in",
  required: true,
  ...l,
});
const inches = (value: number) => ({ value, unit: "in" as const });
const v8: EngineShape = {
  cylinders: 8,
  layout: "v",
  mains: 5,
  valvesPerCylinder: 2,
  unitSystem: "inch",
  nominalSizes: { bore: 4.0, mainJournal: 2.449, rodJournal: 2.099 },
};
// The demo's kind of job: bored 0.030 in over, crank ground 0.010 in under (invented job figures).
const overbored: EngineShape = { ...v8, finishedSizes: { bore: 4.03, mainJournal: 2.439, rodJournal: 2.089 } };

describe("job_size_tol: a tolerance around the size the job states (plain arithmetic)", () => {
  it("finished bore +0.0000/+0.0005 in on a 4.030 in bore is 4.0300 to 4.0305", () => {
    const r = resolveLimit(lim({ tolPlus: 0.0005, tolMinus: 0 }), { jobSize: inches(4.03) });
    expect(r).toEqual({ unit: "in", nominal: 4.03, min: 4.03, max: 4.0305 });
  });
  it("rod journal −0.0005/+0.0000 on a 2.089 in undersize journal is 2.0885 to 2.0890", () => {
    const l = lim({ characteristic: "rod_journal_diameter", tolPlus: 0, tolMinus: 0.0005 });
    expect(resolveLimit(l, { jobSize: inches(2.089) })).toEqual({
      unit: "in",
      nominal: 2.089,
      min: 2.0885,
      max: 2.089,
    });
  });
  // 1 in = 25.4 mm exactly (NIST SP 811 B.8), cross-checked with mathjs
  it("a job in mm with a sheet in inches: 102.362 mm = 4.03 in", () => {
    const r = resolveLimit(lim({ tolPlus: 0.0005, tolMinus: 0 }), { jobSize: { value: 102.362, unit: "mm" } });
    expect(r.nominal).toBeCloseTo(mathUnit(102.362, "mm").toNumber("inch"), 12);
    expect(r).toEqual({ unit: "in", nominal: 4.03, min: 4.03, max: 4.0305 });
  });
  it.each([
    [lim({ tolPlus: 0.0005, tolMinus: 0 }), {}, /follows the job's finished bore; enter it on the job/],
    [lim({ characteristic: "main_journal_diameter", tolPlus: 0.0005, tolMinus: 0 }), {}, /finished main journal/],
    [
      lim({ characteristic: "piston_skirt_diameter", tolPlus: 0.0005, tolMinus: 0 }),
      { jobSize: inches(4.03) },
      /only for bores/,
    ],
    [lim({ tolPlus: 0.0005 }), { jobSize: inches(4.03) }, /minus tolerance/],
    [lim({ tolPlus: 0.0005, tolMinus: -0.0001 }), { jobSize: inches(4.03) }, /both ≥ 0/],
    [lim({ unit: "lbf_ft", tolPlus: 1, tolMinus: 1 }), { jobSize: inches(4.03) }, /only works for lengths/],
  ])("says what is missing or wrong (%#)", (l, context, message) => {
    expect(() => resolveLimit(l, context)).toThrow(message);
  });
});

describe("ISO 286 on the job's size", () => {
  // ISO 286-1:2010 Table 1: IT7 over 80 up to 120 mm = 35 µm; H: lower deviation 0
  it("H7 without a nominal takes the finished bore, not the engine's", () => {
    const l = lim({ limitType: "iso286", unit: "mm", isoClass: "H7" });
    const r = resolveLimit(l, { jobSize: { value: 104.5, unit: "mm" }, nominal: { value: 104, unit: "mm" } });
    expect(r).toEqual({ unit: "mm", nominal: 104.5, min: 104.5, max: 104.535 });
    // without a job size, the engine's nominal bore as before
    expect(resolveLimit(l, { nominal: { value: 104, unit: "mm" } })).toEqual({
      unit: "mm",
      nominal: 104,
      min: 104,
      max: 104.035,
    });
  });
  it("g6 on a 2.089 in rod journal = 53.0606 mm (ISO 286-2:2010 g, 50–80 mm: −10/−29 µm)", () => {
    const l = lim({ characteristic: "rod_journal_diameter", limitType: "iso286", unit: "in", isoClass: "g6" });
    const r = resolveLimit(l, { jobSize: inches(2.089) });
    expect(r.max).toBeCloseTo(mathUnit(53.0606 - 0.01, "mm").toNumber("inch"), 9);
    expect(r.min).toBeCloseTo(mathUnit(53.0606 - 0.029, "mm").toNumber("inch"), 9);
  });
  it("a nominal written on the limit still wins (ISO 286-1:2010 Table 1, IT7 30–50 mm = 25 µm)", () => {
    const l = lim({ limitType: "iso286", unit: "mm", isoClass: "H7", nominal: 50 });
    expect(resolveLimit(l, { jobSize: { value: 104.5, unit: "mm" } })).toMatchObject({ min: 50, max: 50.025 });
  });
});

describe("limitContextFor: which size a characteristic's limit follows", () => {
  it("per-inch rules scale with the job's finished size, before a measured or the engine's size", () => {
    expect(limitContextFor("ring_end_gap", overbored, 4.0302)).toEqual({
      diameter: inches(4.03),
      nominal: inches(4.0),
      jobSize: inches(4.03),
    });
    expect(limitContextFor("main_oil_clearance", overbored).diameter).toEqual(inches(2.439));
    expect(limitContextFor("rod_oil_clearance", overbored).diameter).toEqual(inches(2.089));
    // a job that states no sizes: the measured diameter, else the engine's
    expect(limitContextFor("ring_end_gap", v8, 4.0302).diameter).toEqual(inches(4.0302));
    expect(limitContextFor("ring_end_gap", v8).diameter).toEqual(inches(4.0));
  });
  it("ring gap 0.0045 in per inch of a 4.030 in finished bore is 0.018135 in (common practice)", () => {
    const spec = [lim({ characteristic: "ring_end_gap", limitType: "per_inch", perInchMin: 0.0045 })];
    const found = limitsFor(spec, "ring_end_gap", "ring-gap/1/1", limitContextFor("ring_end_gap", overbored));
    expect(found.limits).toEqual({ unit: "in", min: 0.018135 });
  });
  it("a characteristic with no job size gets no job size (deck height)", () => {
    expect(limitContextFor("deck_height", overbored)).toEqual({});
  });
});

describe("readings are judged against the job's own size", () => {
  const spec = [lim({ tolPlus: 0.0005, tolMinus: 0 })];
  it("a 4.0302 in bore is in spec on a job bored to 4.030, out of spec on one at standard size", () => {
    const reading = { stationId: "bore/3/mid/A", value: 4.0302, unit: "in" as const };
    expect(evaluateReading(reading, overbored, spec)).toMatchObject({
      verdict: "in_spec",
      limits: { min: 4.03, max: 4.0305, nominal: 4.03 },
      deviation: 0.0002,
    });
    const standard = { ...v8, finishedSizes: { bore: 4.0 } };
    expect(evaluateReading(reading, standard, spec)).toMatchObject({ verdict: "out_of_spec" });
  });
  it("a job that states no finished bore gets a note, not a verdict", () => {
    const e = evaluateReading({ stationId: "bore/1/top/A", value: 4.0302, unit: "in" }, v8, spec);
    expect(e.verdict).toBeUndefined();
    expect(e.note).toMatch(/finished bore; enter it on the job/);
  });
  it("oil clearance 0.001 in per inch of the 2.439 in finished main journal is 0.002439 (common practice)", () => {
    const perInch = [lim({ characteristic: "main_oil_clearance", limitType: "per_inch", perInchMax: 0.001 })];
    const readings = [
      { stationId: "main/1/front/A", value: 2.4392, unit: "in" as const },
      { stationId: "main-brg/1/front/A", value: 2.4415, unit: "in" as const },
    ];
    const v = deriveReadings(readings, overbored, perInch).find(
      (d) => d.key === "main_oil_clearance@main-brg/1/front/A",
    );
    expect(v).toMatchObject({ value: 0.0023, limits: { max: 0.002439 }, verdict: "in_spec" });
  });
});

describe("sizeChangeWords", () => {
  it.each([
    [4.03, 4.0, "in", "0.030 in oversize"],
    [2.439, 2.449, "in", "0.010 in undersize"],
    [4.0305, 4.0, "in", "0.0305 in oversize"],
    [4.0, 4.0, "in", "standard size"],
    [104.5, 104, "mm", "0.50 mm oversize"],
    [53.75, 54, "mm", "0.25 mm undersize"],
    [null, 4.0, "in", undefined],
    [4.03, null, "in", undefined],
  ] as const)("%s against %s %s: %s", (finished, nominal, unit, words) => {
    expect(sizeChangeWords(finished, nominal, unit)).toBe(words);
  });
});
