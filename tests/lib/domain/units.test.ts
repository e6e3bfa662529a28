import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { unit } from "mathjs";
import {
  CC_PER_CUBIC_IN,
  KPA_PER_PSI,
  MM_PER_IN,
  N_PER_LBF,
  NM_PER_LBF_FT,
  ccToCubicIn,
  cleanDecimal,
  convertLength,
  convertTorque,
  cToF,
  cubicInToCc,
  decimalDifference,
  decimalSum,
  fToC,
  inToMm,
  kpaToPsi,
  lbfFtToNm,
  mmToIn,
  nmToLbfFt,
  psiToKpa,
} from "../../../lib/domain/units";

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

describe("exact definitions", () => {
  it("match NIST SP 811 Appendix B exact factors", () => {
    // NIST SP 811 (2008), B.8: inch = 2.54 E-02 m exact; cubic inch = 1.6387064 E-05 m³ exact
    expect(MM_PER_IN).toBe(25.4);
    expect(rel(CC_PER_CUBIC_IN, 2.54 ** 3)).toBeLessThan(1e-15);
    // NIST SP 811, B.8: pound-force = 4.448 222 E+00 N (lb × standard gravity)
    expect(N_PER_LBF).toBeCloseTo(4.448222, 6);
    // NIST SP 811, B.8: pound-force foot = 1.355 818 E+00 N·m; psi = 6.894 757 E+03 Pa
    expect(NM_PER_LBF_FT).toBeCloseTo(1.355818, 6);
    expect(KPA_PER_PSI).toBeCloseTo(6.894757, 6);
  });
});

describe("conversions agree with mathjs (a general-purpose reference library)", () => {
  const cases: Array<[string, (x: number) => number, string, string, number]> = [
    ["inToMm", inToMm, "in", "mm", 1e-14],
    ["mmToIn", mmToIn, "mm", "in", 1e-14],
    ["cubicInToCc", cubicInToCc, "in^3", "cc", 1e-14],
    ["ccToCubicIn", ccToCubicIn, "cc", "in^3", 1e-14],
    ["lbfFtToNm", lbfFtToNm, "lbf ft", "N m", 1e-14],
    ["nmToLbfFt", nmToLbfFt, "N m", "lbf ft", 1e-14],
    // mathjs defines psi from a rounded factor (6894.75729276459 Pa), within 6e-11 of exact
    ["psiToKpa", psiToKpa, "psi", "kPa", 1e-9],
    ["kpaToPsi", kpaToPsi, "kPa", "psi", 1e-9],
  ];
  for (const [name, fn, from, to, tol] of cases) {
    it(`${name} matches mathjs ${from} → ${to}`, () => {
      fc.assert(
        fc.property(fc.double({ min: 0.001, max: 1e5, noNaN: true }), (x) => {
          expect(rel(fn(x), unit(x, from).toNumber(to))).toBeLessThan(tol);
        }),
      );
    });
  }
  it("fToC and cToF match mathjs degF/degC", () => {
    fc.assert(
      fc.property(fc.double({ min: -100, max: 500, noNaN: true }), (t) => {
        expect(fToC(t)).toBeCloseTo(unit(t, "degF").toNumber("degC"), 9);
        expect(cToF(t)).toBeCloseTo(unit(t, "degC").toNumber("degF"), 9);
      }),
    );
  });
});

describe("round trips (property)", () => {
  const pairs: Array<[string, (x: number) => number, (x: number) => number]> = [
    ["length", inToMm, mmToIn],
    ["volume", cubicInToCc, ccToCubicIn],
    ["torque", lbfFtToNm, nmToLbfFt],
    ["pressure", psiToKpa, kpaToPsi],
    ["temperature", fToC, cToF],
  ];
  for (const [name, there, back] of pairs) {
    it(`${name} converts there and back`, () => {
      fc.assert(
        fc.property(fc.double({ min: -1e4, max: 1e4, noNaN: true }), (x) => {
          expect(Math.abs(back(there(x)) - x)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(x)));
        }),
      );
    });
  }
});

describe("trade figures", () => {
  it("100, 35 and 65 lbf·ft are 135.6, 47.5 and 88.1 N·m", () => {
    // common practice (shop torque charts quote these to 0.1 N·m)
    expect(lbfFtToNm(100)).toBeCloseTo(135.6, 1);
    expect(lbfFtToNm(35)).toBeCloseTo(47.5, 1);
    expect(lbfFtToNm(65)).toBeCloseTo(88.1, 1);
  });
});

describe("generic converters", () => {
  it("convertLength and convertTorque pick the right direction", () => {
    expect(convertLength(1, "in", "mm")).toBe(25.4);
    expect(convertLength(25.4, "mm", "in")).toBe(1);
    expect(convertLength(3.5, "mm", "mm")).toBe(3.5);
    expect(convertTorque(65, "lbf_ft", "nm")).toBe(lbfFtToNm(65));
    expect(convertTorque(88, "nm", "lbf_ft")).toBe(nmToLbfFt(88));
    expect(convertTorque(10, "nm", "nm")).toBe(10);
  });
  it("reject unknown units and non-numbers with a message saying what to fix", () => {
    expect(() => convertLength(1, "cm" as "mm", "in")).toThrow(/Unknown length unit 'cm'; use one of in, mm/);
    expect(() => convertTorque(1, "lbf_ft", "kgm" as "nm")).toThrow(/Unknown torque unit/);
    expect(() => inToMm(Number.NaN)).toThrow(/finite number/);
    expect(() => fToC(Number.POSITIVE_INFINITY)).toThrow(/finite number/);
  });
});

describe("exact decimal helpers", () => {
  it("decimalDifference gives the decimal answer where floats do not", () => {
    expect(4.0312 - 4.0302).not.toBe(0.001); // the float trap this guards against
    expect(decimalDifference(4.0312, 4.0302)).toBe(0.001);
    expect(4.0302 - 4.0301).not.toBe(0.0001);
    expect(decimalDifference(4.0302, 4.0301)).toBe(0.0001);
    expect(decimalDifference(102.362, 102.337)).toBe(0.025);
    expect(decimalDifference(inToMm(4.0302), inToMm(4.0301))).toBe(0.00254);
  });
  it("decimalSum adds signed figures exactly", () => {
    expect(decimalSum([0.1, 0.2])).toBe(0.3);
    expect(decimalSum([9.025, -1.74, -5.7, -1.56])).toBe(0.025);
    expect(decimalSum([])).toBe(0);
    expect(() => decimalSum([1, Number.NaN])).toThrow(/term 2/);
  });
  it("cleanDecimal trims float noise to 12 significant digits and never returns -0", () => {
    expect(cleanDecimal(0.1 + 0.2)).toBe(0.3);
    expect(cleanDecimal(0.3353 * 1.73)).toBe(0.580069);
    expect(Object.is(cleanDecimal(-0), 0)).toBe(true);
    expect(cleanDecimal(Number.POSITIVE_INFINITY)).toBe(Number.POSITIVE_INFINITY);
  });
});
