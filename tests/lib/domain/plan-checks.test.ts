import { describe, expect, it } from "vitest";
import { evaluate } from "mathjs";
import { compressionRatio } from "../../../lib/domain/build-math";
import { FIT_LIMITS_MM, planFigureProblems, planFitWarnings, type PlanSizes } from "../../../lib/domain/plan-checks";

// Deck clearance = deck height − stroke/2 − rod length − compression height (the stack-up in
// build-math.ts, common practice). The fit thresholds are common practice, from memory.
const sbc: PlanSizes = {
  lengthUnit: "in",
  bore: 4.03,
  stroke: 3.48,
  rodLength: 5.7,
  compressionHeight: 1.56,
  deckHeight: 9.025,
  gasketBore: 4.1,
  gasketThickness: 0.039,
  chamberCc: 64,
  pistonCc: 5,
};

describe("planFitWarnings", () => {
  it("says nothing for a stack-up that fits: 9.025 − 1.74 − 5.7 − 1.56 = 0.025 in below the deck", () => {
    expect(planFitWarnings(sbc)).toEqual([]);
  });
  it("warns when the piston stands above the deck beyond the sane amount", () => {
    // 0.025 − 0.04 = −0.015 in, i.e. 0.381 mm out of the hole (> 0.25 mm)
    const w = planFitWarnings({ ...sbc, compressionHeight: 1.6, gasketThickness: 0.04 });
    expect(w).toHaveLength(2);
    expect(w[0]).toMatch(/piston stands 0.015 in above the deck/);
    expect(w[1]).toMatch(/Piston-to-head clearance is only 0.025 in/); // 0.04 − 0.015 = 0.635 mm
  });
  it("accepts 0.005 in out of the hole with enough gasket", () => {
    expect(planFitWarnings({ ...sbc, compressionHeight: 1.59, gasketThickness: 0.041 })).toEqual([]);
  });
  it("warns, in the job's unit, when the crown reaches the head face", () => {
    const w = planFitWarnings({ ...sbc, compressionHeight: 1.6, gasketThickness: 0.01 });
    expect(w.some((x) => /crown reaches the head face/.test(x))).toBe(true);
  });
  it("warns on thin piston-to-head in mm: 0.2 mm below the deck with a 0.4 mm gasket is 0.6 mm", () => {
    const mm: PlanSizes = { lengthUnit: "mm", stroke: 86, rodLength: 145, compressionHeight: 32, deckHeight: 220.2 };
    const w = planFitWarnings({ ...mm, gasketThickness: 0.4 });
    expect(w).toEqual([expect.stringMatching(/only 0.6 mm .*at least 0.75 mm/)]);
    expect(planFitWarnings({ ...mm, gasketThickness: 1.2 })).toEqual([]);
    expect(FIT_LIMITS_MM.pistonToHead).toBe(0.75);
  });
  it("warns when a dome is larger than the chamber, gasket and deck volumes (the core's message)", () => {
    expect(planFitWarnings({ ...sbc, pistonCc: -90 })).toEqual([expect.stringMatching(/piston would hit the head/)]);
  });
  it("says nothing until the four stack-up figures are there", () => {
    expect(planFitWarnings({ ...sbc, rodLength: null })).toEqual([]);
  });
});

describe("planFigureProblems", () => {
  it("refuses a bore typed in mm on an inch plan and a 40 in stroke", () => {
    const p = planFigureProblems({ ...sbc, bore: 102.4, stroke: 40 });
    expect(p.map((x) => x.field).sort()).toEqual(["bore", "stroke"]);
  });
  it("refuses a bore more than 10% from the engine's nominal", () => {
    const p = planFigureProblems({ ...sbc, bore: 4.6 }, { unitSystem: "inch", nominalSizes: { bore: 4.03 } });
    expect(p).toEqual([{ field: "bore", message: expect.stringMatching(/10% away from this engine's 4.03 in bore/) }]);
  });
  it("accepts the plan as entered", () => {
    expect(planFigureProblems(sbc, { unitSystem: "inch", nominalSizes: { bore: 4 } })).toEqual([]);
  });
});

describe("compressionRatio with a flat head (0 cc chamber)", () => {
  it("a diesel with its bowl in the piston: the clearance volume is bowl + gasket + deck", () => {
    // DOE-HDBK-1018/1-93, Diesel Engine Fundamentals, "Compression Ratio and Clearance Volume":
    // CR = (displacement volume + clearance volume) / clearance volume; Heywood (1988) §2.2 alike.
    // Volumes computed independently with mathjs units (figures a typical 104 × 132 mm diesel).
    const r = compressionRatio({
      lengthUnit: "mm",
      bore: 104,
      stroke: 132,
      gasketBore: 105,
      gasketThickness: 1.2,
      deckClearance: -0.4,
      chamberCc: 0,
      pistonCc: 55,
    });
    const vs = evaluate("pi/4 * (104 mm)^2 * 132 mm").toNumber("cc");
    const vc = evaluate("pi/4 * (105 mm)^2 * 1.2 mm + pi/4 * (104 mm)^2 * -0.4 mm").toNumber("cc") + 55;
    expect(r.clearanceCc).toBeCloseTo(vc, 10);
    expect(r.ratio).toBeCloseTo((vs + vc) / vc, 10);
    expect(r.ratio).toBeGreaterThan(16); // diesels run about 15–22 : 1 (common practice)
    expect(r.ratio).toBeLessThan(22);
  });
  it("still refuses a negative chamber and a clearance volume of nothing", () => {
    const flat = {
      lengthUnit: "in",
      bore: 4,
      stroke: 3.5,
      gasketBore: 4.05,
      gasketThickness: 0,
      deckClearance: 0,
    } as const;
    expect(() => compressionRatio({ ...flat, chamberCc: -1, pistonCc: 10 })).toThrow(/enter 0 for a flat head/);
    expect(() => compressionRatio({ ...flat, chamberCc: 0, pistonCc: 0 })).toThrow(/piston would hit the head/);
  });
});
