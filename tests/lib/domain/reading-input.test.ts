import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  convertMeasure,
  coreReading,
  gaugeUncertainty,
  quantityOfUnit,
  verdict,
  type Verdict,
} from "../../../lib/domain";

// Gauge and reading figures are invented fixtures; the arithmetic is the standards'.
const mic = { unit: "in", expandedU: 0.0001, coverageK: 2 };

describe("the gauge's uncertainty a reading is judged with", () => {
  it("is the certificate's U when it is stated at k = 2 in the reading's unit", () => {
    expect(gaugeUncertainty(mic, "in")).toBe(0.0001);
  });
  it("is restated at k = 2 from the certificate's own k", () => {
    // JCGM 100:2008, 6.2.1 and 6.3: uc = U/k, so U at k = 2 is 2·U/k (0.00015 at k = 3 → 0.0001).
    expect(gaugeUncertainty({ ...mic, expandedU: 0.00015, coverageK: 3 }, "in")).toBeCloseTo(0.0001, 15);
    // A k not above zero cannot be divided by: the usual certificate's k = 2 stands in.
    expect(gaugeUncertainty({ ...mic, coverageK: 0 }, "in")).toBe(0.0001);
  });
  it("is converted to the reading's unit, lengths and torques alike", () => {
    // NIST SP 811, B.8: 1 in = 25.4 mm exactly; 1 lbf·ft = 1.355818 N·m.
    expect(gaugeUncertainty({ unit: "mm", expandedU: 0.0254, coverageK: 2 }, "in")).toBeCloseTo(0.001, 15);
    expect(gaugeUncertainty({ unit: "nm", expandedU: 1.355818, coverageK: 2 }, "lbf_ft")).toBeCloseTo(1, 6);
  });
  it("is absent without a gauge, without a U, or across quantities", () => {
    expect(gaugeUncertainty(undefined, "in")).toBeUndefined();
    expect(gaugeUncertainty({ ...mic, expandedU: Number.NaN }, "in")).toBeUndefined();
    expect(gaugeUncertainty({ unit: "lbf_ft", expandedU: 1, coverageK: 2 }, "in")).toBeUndefined();
  });
});

describe("the gauge's budget in the guard band", () => {
  it("adds the gauge's resolution δ/√12 and its study's repeatability s to the certificate", () => {
    // JCGM 100:2008 eq. (10), F.2.2.1 (δ/√12) and 4.2.3 (s of one observation); U = 2·uc (6.2)
    // Certificate 0.0001 in at k = 2, step 0.0001 in, study s = 0.00008 in:
    // uc = √(0.00005² + 0.0000288675² + 0.00008²) = 0.0000986577, U = 0.000197315
    const bore = { ...mic, resolution: 0.0001, study: { repeatSd: 0.00008 } };
    expect(gaugeUncertainty(bore, "in")).toBeCloseTo(0.000197315, 9);
    // Resolution alone: √(0.00005² + 0.0000288675²) · 2 = 0.000115470
    expect(gaugeUncertainty({ ...mic, resolution: 0.0001 }, "in")).toBeCloseTo(0.00011547, 9);
    // In the reading's unit (NIST SP 811, B.8: 1 in = 25.4 mm): 0.000197315 in = 0.0050118 mm
    expect(gaugeUncertainty(bore, "mm")).toBeCloseTo(0.005011809, 9);
  });
  it("leaves out a step or a study figure that is not a number of zero or more", () => {
    expect(gaugeUncertainty({ ...mic, resolution: Number.NaN, study: { repeatSd: -1 } }, "in")).toBe(0.0001);
    expect(gaugeUncertainty({ ...mic, resolution: null, study: null }, "in")).toBe(0.0001);
  });
  it("turns an in-spec reading marginal when the study's repeatability is worse than the certificate", () => {
    // ISO 14253-1:2017 guard band: within U of a limit is not proven in spec
    const limits = { min: 4.03, max: 4.0312 };
    const value = 4.031;
    expect(verdict({ value, ...limits, uncertainty: gaugeUncertainty(mic, "in") })).toBe("in_spec");
    const poorStudy = { ...mic, resolution: 0.0001, study: { repeatSd: 0.00015 } };
    expect(verdict({ value, ...limits, uncertainty: gaugeUncertainty(poorStudy, "in") })).toBe("marginal");
  });
  it("a larger U (certificate, step or study spread) never improves a verdict (property)", () => {
    const rank: Record<Verdict, number> = { in_spec: 0, marginal: 1, out_of_spec: 2 };
    const small = fc.double({ min: 0, max: 0.001, noNaN: true });
    fc.assert(
      fc.property(
        fc.double({ min: 3.99, max: 4.05, noNaN: true }),
        fc.record({ u: small, res: small, sd: small }),
        fc.record({ u: small, res: small, sd: small }),
        (value, base, extra) => {
          const judged = (g: { u: number; res: number; sd: number }) =>
            verdict({
              value,
              min: 4.0,
              max: 4.04,
              uncertainty: gaugeUncertainty(
                { unit: "in", expandedU: g.u, coverageK: 2, resolution: g.res, study: { repeatSd: g.sd } },
                "in",
              ),
            });
          const larger = { u: base.u + extra.u, res: base.res + extra.res, sd: base.sd + extra.sd };
          expect(rank[judged(larger)]).toBeGreaterThanOrEqual(rank[judged(base)]);
        },
      ),
    );
  });
});

describe("a kept reading as the core's input", () => {
  it("carries the figures taken, dropping those not taken (null or left out)", () => {
    const stored = {
      stationId: "torque/main-caps",
      value: 68,
      unit: "lbf_ft",
      takenAt: new Date("2026-12-01T09:30:00Z"),
      partTempC: null,
      gaugeTempC: null,
      lubricant: "engine-oil",
    };
    expect(coreReading(stored)).toEqual({
      stationId: "torque/main-caps",
      value: 68,
      unit: "lbf_ft",
      takenAt: "2026-12-01T09:30:00.000Z",
      lubricant: "engine-oil",
    });
    const onTablet = { stationId: "bore/1/top/A", value: 4.0302, unit: "in", partTempC: 24, gaugeTempC: 21 };
    expect(coreReading(onTablet, mic)).toEqual({
      stationId: "bore/1/top/A",
      value: 4.0302,
      unit: "in",
      temperatureC: 24,
      gaugeTemperatureC: 21,
      uncertainty: 0.0001,
    });
  });
  it("keeps a temperature of 0 °C (a figure, not a gap)", () => {
    expect(coreReading({ stationId: "bore/1/top/A", value: 4.03, unit: "in", partTempC: 0 }).temperatureC).toBe(0);
  });
});

describe("units", () => {
  it("say which quantity they measure and convert only within it", () => {
    expect(quantityOfUnit("in")).toBe("length");
    expect(quantityOfUnit("nm")).toBe("torque");
    expect(quantityOfUnit("psi")).toBeUndefined();
    expect(convertMeasure(1, "in", "mm")).toBe(25.4); // NIST SP 811, B.8: exact
    expect(convertMeasure(2, "nm", "nm")).toBe(2);
    expect(convertMeasure(1, "in", "nm")).toBeUndefined();
  });
});
