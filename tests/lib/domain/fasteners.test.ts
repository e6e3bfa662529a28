import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  FASTENER_CAUTION,
  NUT_FACTORS,
  boltElongation,
  boltStiffness,
  preloadFromTorque,
  recommendedPreload,
  tensileStressAreaMetric,
  tensileStressAreaUnified,
  torqueForPreload,
} from "../../../lib/domain/fasteners";

describe("tensile stress areas", () => {
  it("Unified threads match the ASME B1.1 / Shigley Table 8-2 figures", () => {
    // Shigley's Mechanical Engineering Design, Table 8-2 (from memory): 1/4-28 0.0364, 5/16-24 0.0580,
    // 7/16-14 0.1063, 1/2-13 0.1419 in²
    // tables round to 3–4 figures (5/16-24 is 0.05807 by the formula), so allow 1e-4 as check value P15 does
    const table: Array<[number, number, number]> = [
      [0.25, 28, 0.0364],
      [0.3125, 24, 0.058],
      [0.4375, 14, 0.1063],
      [0.5, 13, 0.1419],
    ];
    for (const [d, n, area] of table) {
      expect(Math.abs(tensileStressAreaUnified(d, n) - area)).toBeLessThanOrEqual(1e-4);
    }
  });
  it("ISO metric threads match ISO 898-1 As,nom", () => {
    // ISO 898-1:2013 Table 4/6 (from memory): M6 20.1, M10 58.0, M16 157, M10x1 64.5 mm²
    expect(tensileStressAreaMetric(6, 1)).toBeCloseTo(20.1, 1);
    expect(tensileStressAreaMetric(10, 1.5)).toBeCloseTo(58.0, 1);
    expect(tensileStressAreaMetric(16, 2)).toBeCloseTo(157, 0);
    expect(tensileStressAreaMetric(10, 1)).toBeCloseTo(64.5, 1);
  });
  it("the ISO mean diameter d − 0.938194·P is (d2 + d3)/2 of the basic profile", () => {
    // ISO 68-1 basic profile: H = √3/2·P, d2 = d − 0.75·H, d3 = d − 17/12·H (ISO 898-1 9.1.6.1)
    const d = 12;
    const p = 1.75;
    const h = (Math.sqrt(3) / 2) * p;
    const mean = (d - 0.75 * h + (d - (17 / 12) * h)) / 2;
    expect(tensileStressAreaMetric(d, p)).toBeCloseTo((Math.PI / 4) * mean * mean, 10);
  });
  it("rejects impossible threads", () => {
    expect(() => tensileStressAreaUnified(0.05, 10)).toThrow(/too coarse/);
    expect(() => tensileStressAreaMetric(10, 0)).toThrow(/pitch/);
    expect(() => tensileStressAreaUnified(-0.375, 24)).toThrow(/greater than zero/);
  });
});

describe("elongation, stiffness, preload", () => {
  it("boltStiffness equals Shigley's closed form kb = Ad·At·E/(Ad·lt + At·ld)", () => {
    // Shigley's Mechanical Engineering Design, Ch. 8, Eq. 8-17 (from memory)
    const ad = (Math.PI / 4) * 0.375 ** 2;
    const at = 0.0878;
    const e = 30e6;
    const closed = (ad * at * e) / (ad * 0.6 + at * 1.0);
    const k = boltStiffness({ shankArea: ad, stressArea: at, modulus: e, shankLength: 1.0, threadLength: 0.6 });
    expect(k).toBeCloseTo(closed, 6);
  });
  it("a fully threaded grip gives k = At·E/L, consistent with boltElongation", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 100, max: 50000, noNaN: true }),
        fc.double({ min: 0.5, max: 100, noNaN: true }),
        (force, length) => {
          const k = boltStiffness({
            shankArea: 80,
            stressArea: 61.2,
            modulus: 207000,
            shankLength: 0,
            threadLength: length,
          });
          const delta = boltElongation(force, length, 61.2, 207000);
          expect(Math.abs(force / k - delta) / delta).toBeLessThan(1e-12);
        },
      ),
    );
  });
  it("a threaded section makes the bolt softer than an all-shank bolt", () => {
    const base = { shankArea: 0.1104, stressArea: 0.0878, modulus: 30e6 };
    const allShank = boltStiffness({ ...base, shankLength: 1.6, threadLength: 0 });
    const mixed = boltStiffness({ ...base, shankLength: 1.0, threadLength: 0.6 });
    expect(mixed).toBeLessThan(allShank);
    expect(() => boltStiffness({ ...base, shankLength: 0, threadLength: 0 })).toThrow(/both be zero/);
  });
  it("T = K·F·d and its inverse round-trip", () => {
    // Shigley Ch. 8, Eq. 8-27: 540 lbf·in, K 0.18, d 0.375 in → 8000 lbf (check value P13)
    expect(preloadFromTorque(540, 0.18, 0.375)).toBeCloseTo(8000, 9);
    expect(torqueForPreload(8000, 0.18, 0.375)).toBeCloseTo(540, 9);
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e5, noNaN: true }), (f) => {
        expect(preloadFromTorque(torqueForPreload(f, 0.2, 10), 0.2, 10)).toBeCloseTo(f, 6);
      }),
    );
  });
  it("recommended preload is 0.75 of proof load for a reused joint", () => {
    // Shigley Ch. 8, Eq. 8-31: Fp = At·Sp, Fi = 0.75·Fp (check value P14)
    const r = recommendedPreload({ stressArea: 0.0878, proofStrength: 120000 });
    expect(r.proofLoad).toBeCloseTo(10536, 9);
    expect(r.preload).toBeCloseTo(7902, 9);
    expect(recommendedPreload({ stressArea: 0.0878, proofStrength: 120000, fraction: 0.9 }).preload).toBeCloseTo(
      9482.4,
      9,
    );
    expect(() => recommendedPreload({ stressArea: 0.0878, proofStrength: 120000, fraction: 1.2 })).toThrow(/fraction/);
  });
  it("rejects nonsense inputs with the quantity named", () => {
    expect(() => boltElongation(8000, 1.6, 0, 30e6)).toThrow(/Cross-section area/);
    expect(() => preloadFromTorque(540, 0, 0.375)).toThrow(/Nut factor K/);
    expect(() => torqueForPreload(-1, 0.2, 0.375)).toThrow(/Preload/);
  });
});

describe("NUT_FACTORS", () => {
  it("carries Shigley Table 8-15 values and a source for every entry", () => {
    // Shigley's Mechanical Engineering Design, Table 8-15 (Blake & Kurtz), from memory
    expect(NUT_FACTORS.dry_black_oxide.nutFactor).toBe(0.3);
    expect(NUT_FACTORS.zinc_plated.nutFactor).toBe(0.2);
    expect(NUT_FACTORS.oiled.nutFactor).toBe(0.18);
    expect(NUT_FACTORS.cadmium_plated.nutFactor).toBe(0.16);
    expect(NUT_FACTORS.anti_seize.nutFactor).toBe(0.12);
    for (const entry of Object.values(NUT_FACTORS)) {
      expect(entry.source.length).toBeGreaterThan(10);
      expect(entry.label.length).toBeGreaterThan(3);
      expect(entry.nutFactor).toBeGreaterThan(0.05);
      expect(entry.nutFactor).toBeLessThan(0.4);
    }
  });
  it("a lubricated thread makes more preload for the same torque", () => {
    const t = 540;
    expect(preloadFromTorque(t, NUT_FACTORS.moly_paste.nutFactor, 0.375)).toBeGreaterThan(
      preloadFromTorque(t, NUT_FACTORS.dry_black_oxide.nutFactor, 0.375),
    );
  });
  it("ships a caution deferring to the maker's specifications", () => {
    expect(FASTENER_CAUTION).toMatch(/maker's torque, stretch and lubricant/);
  });
});
