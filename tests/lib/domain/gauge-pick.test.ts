import { describe, expect, it } from "vitest";
import { defaultGauge, expectedFigure, type EngineShape, type SpecLimit } from "../../../lib/domain";

// Which gauge the tablet proposes: a gauge whose range holds the size the station should read
// (common practice: a micrometer is chosen by its range, 0–1, 1–2, … in, so the figure falls in it).
type G = {
  id: number;
  kind: string;
  label: string;
  unit: string;
  active: boolean;
  rangeMin?: number;
  rangeMax?: number;
};
const mic = (id: number, lo: number, hi: number): G => ({
  id,
  kind: "outside_mic",
  label: `Outside mic ${lo}–${hi}`,
  unit: "in",
  active: true,
  rangeMin: lo,
  rangeMax: hi,
});
const small = mic(1, 2, 3);
const large = mic(2, 4, 5);
const skirt = { value: 4.0285, unit: "in" as const };

describe("the gauge proposed at a station", () => {
  it("is one whose range holds the expected size, not the first by name", () => {
    expect(defaultGauge("piston_skirt_diameter", [small, large], undefined, skirt)?.id).toBe(large.id);
  });
  it("keeps the machinist's pick while its range holds the size, and leaves it when it cannot", () => {
    const both = [small, large, mic(3, 4, 5)];
    expect(defaultGauge("piston_skirt_diameter", both, 3, skirt)?.id).toBe(3);
    expect(defaultGauge("piston_skirt_diameter", both, small.id, skirt)?.id).toBe(large.id);
  });
  it("falls back to the pick, then the first suitable gauge, when no range holds the size", () => {
    const huge = { value: 9, unit: "in" as const };
    expect(defaultGauge("piston_skirt_diameter", [small, large], large.id, huge)?.id).toBe(large.id);
    expect(defaultGauge("piston_skirt_diameter", [small, large], undefined, huge)?.id).toBe(small.id);
    expect(defaultGauge("piston_skirt_diameter", [small, large])?.id).toBe(small.id);
  });
  it("compares across units: a 100–125 mm micrometer holds a 4.0285 in skirt (102.32 mm)", () => {
    // NIST SP 811, B.8: 1 in = 25.4 mm exactly; 4.0285 × 25.4 = 102.3239 mm.
    const metric = { ...mic(4, 100, 125), unit: "mm" };
    expect(defaultGauge("piston_skirt_diameter", [small, metric], undefined, skirt)?.id).toBe(4);
  });
});

describe("the figure a station should read", () => {
  const engine: EngineShape = {
    cylinders: 8,
    layout: "v",
    mains: 5,
    valvesPerCylinder: 2,
    boltsPerRod: 2,
    ringsPerPiston: 3,
    unitSystem: "inch",
    materials: {},
    nominalSizes: { bore: 4 },
    finishedSizes: { bore: 4.03 },
  };
  const limit = (over: Partial<SpecLimit>): SpecLimit =>
    ({ stationPattern: "*", unit: "in", required: true, ...over }) as SpecLimit;
  it("is the nominal of a tolerance, here the job's finished bore", () => {
    const spec = [limit({ characteristic: "bore_diameter", limitType: "job_size_tol", tolPlus: 0.0005, tolMinus: 0 })];
    expect(expectedFigure(spec, "bore/1/top/A", engine)).toEqual({ value: 4.03, unit: "in" });
  });
  it("is the middle of a window, or its one edge", () => {
    // Plain arithmetic: (4.0265 + 4.0275) / 2 = 4.027.
    const window = [limit({ characteristic: "piston_skirt_diameter", limitType: "min_max", min: 4.0265, max: 4.0275 })];
    expect(expectedFigure(window, "skirt/1", engine)?.value).toBeCloseTo(4.027, 10);
    const cap = [limit({ characteristic: "fastener_torque", limitType: "max_only", unit: "lbf_ft", max: 65 })];
    expect(expectedFigure(cap, "torque/main-caps", engine)).toEqual({ value: 65, unit: "lbf_ft" });
  });
  it("is unknown where the spec has no limit", () => {
    expect(expectedFigure([], "bore/1/top/A", engine)).toBeUndefined();
  });
});
