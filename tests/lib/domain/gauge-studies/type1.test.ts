import fc from "fast-check";
import tCdf from "@stdlib/stats-base-dists-t-cdf";
import jStat from "jstat";
import * as ss from "simple-statistics";
import { describe, expect, it } from "vitest";
import {
  DEFAULT_STUDY_THRESHOLDS,
  capabilityFor,
  checkType1Readings,
  type1Study,
  type Type1Input,
} from "../../../../lib/domain";
import { NIST_MAVRO } from "./datasets";

const thresholds = { ...DEFAULT_STUDY_THRESHOLDS };
const reference = { value: 2.0018, expandedU: 0.00002, coverageK: 2 };
const mavro: Type1Input = {
  readings: NIST_MAVRO.data,
  reference,
  resolution: 0.0001,
  characteristics: [
    { characteristic: "bore", tolerance: 0.02 },
    { characteristic: "journal", tolerance: 0.005 },
  ],
  thresholds,
};

describe("type1Study", () => {
  it("gives the certified mean and standard deviation of a published dataset", () => {
    const r = type1Study(mavro);
    // NIST StRD univariate summary statistics, Mavro: certified mean and sample standard deviation
    expect(r.n).toBe(50);
    expect(r.mean).toBeCloseTo(NIST_MAVRO.certifiedMean, 14);
    expect(r.sd / NIST_MAVRO.certifiedSd).toBeCloseTo(1, 11);
  });

  it("tests the bias with Student's t as a statistics package does", () => {
    const r = type1Study(mavro);
    expect(r.bias).toBeCloseTo(0.000056, 14);
    // One-sample t-test against the reference (sample s, n − 1), cross-checked with jstat and simple-statistics
    expect(r.sd).toBeCloseTo(ss.sampleStandardDeviation(NIST_MAVRO.data), 15);
    expect(r.t).toBeCloseTo(-jStat.tscore(reference.value, NIST_MAVRO.data), 10);
    expect(r.t).toBeCloseTo(0.000056 / (NIST_MAVRO.certifiedSd / Math.sqrt(50)), 8);
    expect(r.pValue).toBeCloseTo(2 * tCdf(-Math.abs(r.t!), 49), 7); // @stdlib's Student's t
    expect(r.pValue).toBeGreaterThan(0.05);
    expect(r.biasSignificant).toBe(false);
  });

  it("finds a bias significant when the reference is off by several standard errors", () => {
    const r = type1Study({ ...mavro, reference: { ...reference, value: 2.0016 } });
    expect(r.pValue).toBeCloseTo(2 * tCdf(-Math.abs(r.t!), 49), 7); // @stdlib's Student's t
    expect(r.pValue).toBeLessThan(0.05);
    expect(r.biasSignificant).toBe(true);
    expect(r.notes.join(" ")).toMatch(/reads 0\.000256 off the reference/);
  });

  it("judges each characteristic by Cg = 0.2·T/(6·s) and Cgk = (0.1·T − |bias|)/(3·s) (common practice)", () => {
    const [bore, journal] = type1Study(mavro).perCharacteristic;
    const s = NIST_MAVRO.certifiedSd;
    expect(bore.cg).toBeCloseTo((0.2 * 0.02) / (6 * s), 9);
    expect(bore.cgk).toBeCloseTo((0.1 * 0.02 - 0.000056) / (3 * s), 9);
    expect(bore.resolutionPct).toBeCloseTo(0.5, 12);
    expect(bore).toMatchObject({ characteristic: "bore", pass: true, resolutionOk: true, reasons: [] });
    // T = 0.005: Cg = 0.001/(6·0.000429) = 0.388, Cgk = (0.0005 − 0.000056)/(3·0.000429) = 0.345
    expect(journal.cg).toBeCloseTo(0.3884, 4);
    expect(journal.cgk).toBeCloseTo(0.3449, 4);
    expect(journal.pass).toBe(false);
    expect(journal.reasons).toHaveLength(2);
    expect(journal.reasons[0]).toMatch(/^Cg 0\.39 is below 1\.33/);
    expect(journal.reasons[1]).toMatch(/^Cgk 0\.34 is below 1\.33/);
  });

  it("says so, without dividing, when every reading is the same", () => {
    const r = type1Study({ ...mavro, readings: Array(25).fill(2.0018) });
    expect(r.sd).toBe(0);
    expect(r.bias).toBe(0);
    expect(r.t).toBeNull();
    expect(r.pValue).toBeNull();
    expect(r.biasSignificant).toBe(false);
    expect(r.notes[0]).toMatch(/Every reading was 2\.002/);
    const [bore] = r.perCharacteristic;
    expect(bore.cg).toBeNull();
    expect(bore.cgk).toBeNull();
    expect(bore.pass).toBe(false);
    expect(bore.reasons[0]).toMatch(/Every reading was the same/);
  });

  it("refuses too few readings and figures that are not numbers, in words", () => {
    expect(() => type1Study({ ...mavro, readings: NIST_MAVRO.data.slice(0, 24) })).toThrow(/take 1 more/);
    expect(checkType1Readings(NIST_MAVRO.data.slice(0, 25))).toEqual([]);
    expect(checkType1Readings([...NIST_MAVRO.data, 2.0018])).toEqual([
      "A repeatability study takes at most 50 readings; 51 were given: leave out the last 1.",
    ]);
    expect(checkType1Readings([...NIST_MAVRO.data.slice(0, 29), Number.NaN])[0]).toBe(
      "Reading 30 is not a number: take it again.",
    );
    expect(() => type1Study({ ...mavro, resolution: 0 })).toThrow(/resolution .* must be above zero/);
  });
});

describe("capabilityFor", () => {
  it("fails a gauge whose step is more than 5 % of T (common practice)", () => {
    const c = capabilityFor({ sd: 0.00001, bias: 0 }, 0.001, 0.01, thresholds, "main journal");
    expect(c.resolutionPct).toBeCloseTo(10, 12);
    expect(c.resolutionOk).toBe(false);
    expect(c.reasons).toEqual(["The gauge's step 0.001 is 10 % of the tolerance; at most 5 % will do."]);
  });

  it("passes a step of exactly 5 % of T despite float noise", () => {
    expect(capabilityFor({ sd: 0.00001, bias: 0 }, 0.001, 0.02, thresholds).resolutionOk).toBe(true);
  });

  it("more spread never raises Cg; a larger |bias| never raises Cgk (properties)", () => {
    const positive = fc.double({ min: 1e-6, max: 0.01, noNaN: true });
    fc.assert(
      fc.property(positive, positive, fc.double({ min: -0.01, max: 0.01, noNaN: true }), positive, (s, more, b, t) => {
        const narrow = capabilityFor({ sd: s, bias: b }, 0, t, thresholds);
        const wide = capabilityFor({ sd: s + more, bias: b }, 0, t, thresholds);
        expect(wide.cg!).toBeLessThanOrEqual(narrow.cg!);
        expect(wide.pass && !narrow.pass).toBe(false);
        const biased = capabilityFor({ sd: s, bias: Math.abs(b) + more }, 0, t, thresholds);
        expect(biased.cgk!).toBeLessThanOrEqual(narrow.cgk!);
        expect(biased.pass && !narrow.pass).toBe(false);
      }),
    );
  });
});
