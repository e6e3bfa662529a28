import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  boltStretch,
  endPlay,
  oilClearance,
  oilClearanceRule,
  pistonToWall,
  ringGapRule,
} from "../../../lib/domain/clearances";

describe("differences of readings are exact, so a value on a limit stays on it", () => {
  it("oil clearance in inches and millimetres", () => {
    expect(2.2022 - 2.2).not.toBe(0.0022); // the float trap
    expect(oilClearance(2.2022, 2.2)).toBe(0.0022);
    expect(oilClearance(55.946, 55.88)).toBe(0.066);
    expect(oilClearance(50.025, 49.991)).toBe(0.034);
  });
  it("piston-to-wall, end play and stretch", () => {
    expect(pistonToWall(4.0305, 4.028)).toBe(0.0025);
    expect(pistonToWall(102.375, 102.311)).toBe(0.064);
    expect(endPlay([-0.0003, 0.0062, 0.006])).toBe(0.0065);
    expect(endPlay([0.052, -0.113, 0.1])).toBe(0.213);
    expect(boltStretch(2.0005, 2.0062)).toBe(0.0057);
    expect(boltStretch(50.813, 50.958)).toBe(0.145);
  });
  it("holds for any pair of 4-decimal readings (property)", () => {
    const tenths = fc.integer({ min: 10000, max: 50000 });
    fc.assert(
      fc.property(tenths, tenths, (a, b) => {
        expect(oilClearance(a / 10000, b / 10000)).toBe((a - b) / 10000);
      }),
    );
  });
});

describe("signs and validation", () => {
  it("a journal larger than the bearing gives negative clearance rather than hiding it", () => {
    expect(oilClearance(2.0, 2.0005)).toBe(-0.0005);
  });
  it("tells the user what to fix", () => {
    expect(() => oilClearance(Number.NaN, 2)).toThrow(/Bearing bore must be a number/);
    expect(() => pistonToWall(4.03, Number.POSITIVE_INFINITY)).toThrow(/Piston skirt/);
    expect(() => endPlay([0.001])).toThrow(/at least two dial readings/);
    expect(() => endPlay([0, Number.NaN])).toThrow(/Dial reading 2/);
    expect(() => boltStretch(0, 2)).toThrow(/free length must be greater than zero/);
    expect(() => oilClearanceRule(2.2, -0.001)).toThrow(/per inch/);
    expect(() => ringGapRule(0, 0.0045)).toThrow(/Bore/);
  });
});

describe("rules of thumb", () => {
  it("about 0.001 in of oil clearance per inch gives 0.0022 in on a 2.200 in rod journal", () => {
    // common practice
    expect(oilClearanceRule(2.2)).toBe(0.0022);
    expect(oilClearanceRule(2.2, 0.00075)).toBe(0.00165);
  });
  it("top ring gap of 0.0045 in per inch of a 4.030 in bore is 0.018135 in", () => {
    // common practice; the ring maker's chart governs
    expect(ringGapRule(4.03, 0.0045)).toBe(0.018135);
  });
});
