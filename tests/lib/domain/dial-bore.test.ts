import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { bignumber, subtract, add } from "mathjs";
import { dialBoreDiameter, dialReadingFor } from "../../../lib/domain/dial-bore";

// Reference arithmetic: mathjs BigNumber (a general-purpose decimal library), so the float trap
// (4.03 - -0.0002 = 4.030200000000001 in binary) cannot hide in the expected values.
const ref = (setting: number, dial: number, plusSmaller: boolean) =>
  Number((plusSmaller ? subtract(bignumber(setting), bignumber(dial)) : add(bignumber(setting), bignumber(dial))).toString());

describe("dial bore gauge: diameter from setting size and dial reading", () => {
  it("plus means smaller (the usual dial bore gauge; common practice, from memory)", () => {
    expect(dialBoreDiameter(4.03, 0.0003, true)).toBe(4.0297);
    expect(dialBoreDiameter(4.03, -0.0002, true)).toBe(4.0302);
    expect(dialBoreDiameter(4.03, -0.0002, true)).toBe(ref(4.03, -0.0002, true));
    expect(dialBoreDiameter(104, 0.012, true)).toBe(103.988);
  });
  it("plus means larger (gauges set up the other way; per-gauge setting)", () => {
    expect(dialBoreDiameter(4.03, 0.0003, false)).toBe(4.0303);
    expect(dialBoreDiameter(104, -0.012, false)).toBe(103.988);
  });
  it("a zero reading is the setting size itself", () => {
    expect(dialBoreDiameter(3.5925, 0, true)).toBe(3.5925);
    expect(dialBoreDiameter(3.5925, 0, false)).toBe(3.5925);
  });
  it("matches mathjs BigNumber for any 4-decimal setting and dial (property)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 20000, max: 60000 }), fc.integer({ min: -50, max: 50 }), fc.boolean(), (s, d, plus) => {
        const setting = s / 10000;
        const dial = d / 10000;
        expect(dialBoreDiameter(setting, dial, plus)).toBe(ref(setting, dial, plus));
        expect(dialReadingFor(setting, dialBoreDiameter(setting, dial, plus), plus)).toBe(dial === 0 ? 0 : dial);
      }),
    );
  });
  it("refuses figures that cannot be right, saying what to fix", () => {
    expect(() => dialBoreDiameter(Number.NaN, 0.001, true)).toThrow(/Setting size must be a number/);
    expect(() => dialBoreDiameter(4.03, Number.POSITIVE_INFINITY, true)).toThrow(/Dial reading must be a number/);
    expect(() => dialBoreDiameter(0, 0.001, true)).toThrow(/greater than zero/);
    expect(() => dialBoreDiameter(0.001, 0.002, true)).toThrow(/check the setting size and the sign/);
  });
});
