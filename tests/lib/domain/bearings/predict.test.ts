import { describe, expect, it } from "vitest";
import { installedClearance } from "@/lib/domain";

describe("installedClearance", () => {
  it("is housing bore minus both walls minus the journal, exactly", () => {
    // Common practice arithmetic: installed bore 2.2500 − 2 × 0.0745 = 2.1010 in; the check-values
    // file's P08 then gives 2.1010 − 2.0988 = 0.0022 in (definition: clearance = ID − OD).
    const r = installedClearance({ housingBore: 2.25, upperWall: 0.0745, lowerWall: 0.0745, journal: 2.0988 });
    expect(r.clearance).toBe(0.0022);
    expect(r.uncertainty).toBe(0);
  });

  it("moves by half a set's stated change when one half comes from it", () => {
    // Common practice: a half from a set 0.001 in thicker than standard tightens by 0.0005 in.
    const std = installedClearance({ housingBore: 2.25, upperWall: 0.0745, lowerWall: 0.0745, journal: 2.0988 });
    const mixed = installedClearance({ housingBore: 2.25, upperWall: 0.075, lowerWall: 0.0745, journal: 2.0988 });
    expect(std.clearance - mixed.clearance).toBeCloseTo(0.0005, 12);
    expect(mixed.clearance).toBe(0.0017);
  });

  it("combines the gauges' U in quadrature (JCGM 100:2008, eq. 10, c = ±1, k = 2)", () => {
    // u = U/2 each: sqrt(0.00005² + 0.00005²) = 0.0000707…, U = 2u = 0.000141421…
    const r = installedClearance({
      housingBore: 2.25,
      upperWall: 0.0745,
      lowerWall: 0.0745,
      journal: 2.0988,
      housingU: 0.0001,
      journalU: 0.0001,
    });
    expect(r.uncertainty).toBeCloseTo(0.0001 * Math.SQRT2, 12);
  });
});
