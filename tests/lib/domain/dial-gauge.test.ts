import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { add, bignumber, subtract } from "mathjs";
import { dialDiameter } from "../../../lib/domain/dial-gauge";

// Reference arithmetic: mathjs BigNumber (a general-purpose decimal library), so the float trap
// (4.03 - -0.0002 = 4.030200000000001 in binary) cannot hide in the expected values.
const ref = (setting: number, dial: number, plusSmaller: boolean) =>
  Number(
    (plusSmaller ? subtract(bignumber(setting), bignumber(dial)) : add(bignumber(setting), bignumber(dial))).toString(),
  );

describe("dial bore gauge: diameter from setting size and dial reading", () => {
  it("plus means smaller (the usual dial bore gauge; common practice, from memory)", () => {
    expect(dialDiameter({ setting: 4.03, deviation: 0.0003, plusMeansSmaller: true })).toBe(4.0297);
    expect(dialDiameter({ setting: 4.03, deviation: -0.0002, plusMeansSmaller: true })).toBe(4.0302);
    expect(dialDiameter({ setting: 104, deviation: 0.012, plusMeansSmaller: true })).toBe(103.988);
  });
  it("plus means larger (gauges set up the other way; a per-gauge setting)", () => {
    expect(dialDiameter({ setting: 4.03, deviation: 0.0003, plusMeansSmaller: false })).toBe(4.0303);
    expect(dialDiameter({ setting: 104, deviation: -0.012, plusMeansSmaller: false })).toBe(103.988);
  });
  it("a zero reading is the setting size itself", () => {
    expect(dialDiameter({ setting: 3.5925, deviation: 0, plusMeansSmaller: true })).toBe(3.5925);
  });
  it("matches mathjs BigNumber for any 4-decimal setting and dial reading (property)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 20000, max: 60000 }),
        fc.integer({ min: -50, max: 50 }),
        fc.boolean(),
        (s, d, plus) => {
          expect(dialDiameter({ setting: s / 10000, deviation: d / 10000, plusMeansSmaller: plus })).toBe(
            ref(s / 10000, d / 10000, plus),
          );
        },
      ),
    );
  });
  it("refuses figures that cannot be right, saying what to fix", () => {
    expect(() => dialDiameter({ setting: Number.NaN, deviation: 0.001, plusMeansSmaller: true })).toThrow(
      /setting size must be a number/,
    );
    expect(() => dialDiameter({ setting: 4.03, deviation: Number.POSITIVE_INFINITY, plusMeansSmaller: true })).toThrow(
      /dial reading must be a number/,
    );
    expect(() => dialDiameter({ setting: 0, deviation: 0.001, plusMeansSmaller: true })).toThrow(/above zero/);
    expect(() => dialDiameter({ setting: 0.001, deviation: 0.002, plusMeansSmaller: true })).toThrow(
      /give no diameter/,
    );
  });
});
