import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { clearanceUncertainty, readingUncertainty } from "../../../lib/domain/uncertainty";

describe("readingUncertainty", () => {
  it("combines calibration, resolution and repeatability in quadrature", () => {
    // JCGM 100:2008 eq. (10), 4.2.3 s/√n, F.2.2.1 δ/√12, 6.2 U = k·uc (check value P24)
    const r = readingUncertainty({ calibrationU: 0.0001, resolution: 0.0001, repeatSd: 6e-5, repeatN: 5 });
    expect(r.uCal).toBeCloseTo(5e-5, 15);
    expect(r.uRes).toBeCloseTo(2.886751346e-5, 13);
    expect(r.uRep).toBeCloseTo(2.683281573e-5, 13);
    expect(r.uc).toBeCloseTo(6.366579406e-5, 13);
    expect(r.U).toBeCloseTo(1.273315881e-4, 12);
  });
  it("resolution alone gives δ/√12 (JCGM 100:2008 F.2.2.1)", () => {
    const r = readingUncertainty({ calibrationU: 0, resolution: 0.001 });
    expect(r.uc).toBeCloseTo(0.001 / Math.sqrt(12), 15);
    expect(r.U).toBeCloseTo((2 * 0.001) / Math.sqrt(12), 15);
  });
  it("a repeatability standard deviation without a count is one reading (n = 1)", () => {
    const r = readingUncertainty({ calibrationU: 0, resolution: 0, repeatSd: 0.0003 });
    expect(r.uc).toBeCloseTo(0.0003, 15);
  });
  it("honours another coverage factor for both the certificate and U", () => {
    const r = readingUncertainty({ calibrationU: 0.003, k: 3, resolution: 0 });
    expect(r.uc).toBeCloseTo(0.001, 15);
    expect(r.U).toBeCloseTo(0.003, 15);
  });
  it("never shrinks when a component grows (property)", () => {
    const u = fc.double({ min: 0, max: 0.01, noNaN: true });
    fc.assert(
      fc.property(u, u, u, u, (cal, res, sd, extra) => {
        const a = readingUncertainty({ calibrationU: cal, resolution: res, repeatSd: sd, repeatN: 3 });
        const b = readingUncertainty({ calibrationU: cal + extra, resolution: res, repeatSd: sd, repeatN: 3 });
        expect(b.uc).toBeGreaterThanOrEqual(a.uc);
      }),
    );
  });
  it("asks for usable inputs", () => {
    expect(() => readingUncertainty({ calibrationU: -1, resolution: 0.001 })).toThrow(/Calibration uncertainty/);
    expect(() => readingUncertainty({ calibrationU: 0.001, k: 0, resolution: 0.001 })).toThrow(/Coverage factor/);
    expect(() => readingUncertainty({ calibrationU: 0.001, resolution: 0.001, repeatSd: 1e-4, repeatN: 2.5 })).toThrow(
      /whole number/,
    );
  });
});

describe("clearanceUncertainty", () => {
  it("independent readings add in quadrature (JCGM 100:2008 eq. 10)", () => {
    expect(clearanceUncertainty({ uBore: 3e-5, uJournal: 4e-5 })).toBeCloseTo(5e-5, 15);
  });
  it("a shared component cancels in the difference (JCGM 100:2008 5.2.2, r = 1)", () => {
    // u² = uB² + uJ² − 2·us²: with us = 2e-5 inside both, 9e-10 + 16e-10 − 8e-10 = 17e-10
    expect(clearanceUncertainty({ uBore: 3e-5, uJournal: 4e-5, uShared: 2e-5 })).toBeCloseTo(Math.sqrt(17e-10), 15);
    expect(clearanceUncertainty({ uBore: 2e-5, uJournal: 2e-5, uShared: 2e-5 })).toBe(0);
  });
  it("throws when the shared part is bigger than the readings allow", () => {
    expect(() => clearanceUncertainty({ uBore: 1e-5, uJournal: 1e-5, uShared: 2e-5 })).toThrow(/contained in both/);
    expect(() => clearanceUncertainty({ uBore: Number.NaN, uJournal: 1e-5 })).toThrow(/Bore uncertainty/);
  });
});
