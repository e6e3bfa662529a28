import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { EXPANSION_COEFFICIENTS, REFERENCE_TEMP_C, correctTo20C } from "../../../lib/domain/thermal";

describe("correctTo20C", () => {
  it("uses the ISO 1 reference temperature of 20 °C", () => {
    // ISO 1:2022, standard reference temperature for GPS
    expect(REFERENCE_TEMP_C).toBe(20);
    expect(correctTo20C({ length: 4.03, partTempC: 20, alphaPart: 11.4e-6 })).toBe(4.03);
  });
  it("part-only form shrinks a warm aluminium part back to its 20 °C size", () => {
    // Callister Table B.6: Al 356.0 α = 21.5e-6/K; L20 = L/(1 + α·Δt) = 3.99914018 (check value P22)
    expect(correctTo20C({ length: 4, partTempC: 30, alphaPart: 21.5e-6 })).toBeCloseTo(3.99914018, 8);
  });
  it("differential form: a steel part with a steel gauge at the same temperature needs no correction", () => {
    // ISO/TR 16015:2003 nominal differential expansion (from memory): L·(αp·Δtp − αg·Δtg) → 0
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 45, noNaN: true }),
        fc.double({ min: 1, max: 500, noNaN: true }),
        (t, length) => {
          const a = EXPANSION_COEFFICIENTS.gaugeSteel.alpha;
          const l20 = correctTo20C({ length, partTempC: t, alphaPart: a, gaugeTempC: t, alphaGauge: a });
          expect(Math.abs(l20 - length)).toBeLessThan(1e-12 * length);
        },
      ),
    );
  });
  it("matches the first-order form L·(1 − (αp − αg)·Δt) to within second-order terms", () => {
    // ISO/TR 16015:2003 (from memory); aluminium part, steel gauge, both 30 °C (check value P21)
    const l20 = correctTo20C({ length: 4, partTempC: 30, alphaPart: 21.5e-6, gaugeTempC: 30, alphaGauge: 11.5e-6 });
    expect(l20).toBeCloseTo(4 * (1 - 10e-6 * 10), 6);
    expect(l20).toBeCloseTo(3.99960009, 8);
  });
  it("defaults the gauge to gauge steel when only its temperature is given", () => {
    const withDefault = correctTo20C({ length: 100, partTempC: 25, alphaPart: 11.4e-6, gaugeTempC: 22 });
    const explicit = correctTo20C({
      length: 100,
      partTempC: 25,
      alphaPart: 11.4e-6,
      gaugeTempC: 22,
      alphaGauge: 11.5e-6,
    });
    expect(withDefault).toBe(explicit);
  });
  it("catches a coefficient typed in µm/m·K and non-numbers", () => {
    expect(() => correctTo20C({ length: 4, partTempC: 30, alphaPart: 21.5 })).toThrow(/per °C \(e\.g\. 11\.4e-6/);
    expect(() => correctTo20C({ length: 4, partTempC: Number.NaN, alphaPart: 21.5e-6 })).toThrow(/Part temperature/);
    expect(() =>
      correctTo20C({ length: 4, partTempC: 30, alphaPart: 21.5e-6, gaugeTempC: 30, alphaGauge: 11.5 }),
    ).toThrow(/Gauge expansion/);
  });
});

describe("EXPANSION_COEFFICIENTS", () => {
  it("lists the shop's materials, each with a source and a plausible metal coefficient", () => {
    const keys = Object.keys(EXPANSION_COEFFICIENTS);
    for (const k of [
      "greyCastIron",
      "compactedGraphiteIron",
      "aluminium356",
      "aluminium319",
      "forgedPiston2618",
      "forgedPiston4032",
      "steel4140",
      "steel4340",
      "gaugeSteel",
    ]) {
      expect(keys).toContain(k);
    }
    for (const entry of Object.values(EXPANSION_COEFFICIENTS)) {
      expect(entry.source.length).toBeGreaterThan(10);
      expect(entry.alpha).toBeGreaterThan(9e-6);
      expect(entry.alpha).toBeLessThan(25e-6);
    }
  });
  it("carries the Callister Table B.6 figures", () => {
    // Callister & Rethwisch, Appendix B Table B.6: gray iron G3000 11.4, Al 356.0 21.5, steel 4140 12.3 ×10⁻⁶/K
    expect(EXPANSION_COEFFICIENTS.greyCastIron.alpha).toBe(11.4e-6);
    expect(EXPANSION_COEFFICIENTS.aluminium356.alpha).toBe(21.5e-6);
    expect(EXPANSION_COEFFICIENTS.steel4140.alpha).toBe(12.3e-6);
    // ISO 3650:1998 6.2.2 (from memory): gauge block steel 11.5e-6/K
    expect(EXPANSION_COEFFICIENTS.gaugeSteel.alpha).toBe(11.5e-6);
  });
  it("a high-silicon 4032 piston grows less than a 2618 one (why 4032 runs tighter)", () => {
    // ASM Handbook Vol. 2 (from memory)
    expect(EXPANSION_COEFFICIENTS.forgedPiston4032.alpha).toBeLessThan(EXPANSION_COEFFICIENTS.forgedPiston2618.alpha);
  });
});
