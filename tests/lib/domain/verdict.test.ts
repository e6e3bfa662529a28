import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { conformanceZone, deviationFromNominal, formatDeviation, verdict } from "../../../lib/domain/verdict";
import type { Verdict } from "../../../lib/domain/enums";

interface GuardBandCase {
  id: string;
  source: string;
  inputs: { LSL: { value: number }; USL: { value: number }; U_k2: { value: number }; measured: { value: number[] } };
  expected: { conformance_zone: { value: [number, number] }; state_3: Verdict[] };
}
const cases = JSON.parse(readFileSync(new URL("./fixtures/check-values.json", import.meta.url), "utf8")) as {
  id: string;
}[];
const p23 = cases.find((c) => c.id === "P23") as unknown as GuardBandCase;

const RANK: Record<Verdict, number> = { in_spec: 0, marginal: 1, out_of_spec: 2 };

describe("exact at every limit edge, inch", () => {
  // The float trap the issue names: 4.0312 − 4.0302 is 0.001000000000000334 as a double.
  it("a taper of 4.0312 − 4.0302 on a 0.0010 in max is in spec", () => {
    expect(4.0312 - 4.0302).toBeGreaterThan(0.001);
    expect(verdict({ value: 4.0312 - 4.0302, max: 0.001 })).toBe("in_spec");
  });
  it("one tenth over the max is out of spec, and so is a hundred-thousandth", () => {
    expect(verdict({ value: 4.0313 - 4.0302, max: 0.001 })).toBe("out_of_spec");
    expect(verdict({ value: 0.00100001, max: 0.001 })).toBe("out_of_spec");
  });
  it("2.2022 − 2.2000 on a 0.0022 in min is in spec (the double is 0.00219999…)", () => {
    expect(2.2022 - 2.2).toBeLessThan(0.0022);
    expect(verdict({ value: 2.2022 - 2.2, min: 0.0022, max: 0.003 })).toBe("in_spec");
    expect(verdict({ value: 2.2021 - 2.2, min: 0.0022, max: 0.003 })).toBe("out_of_spec");
  });
  it("a diameter exactly on either limit of a two-sided zone is in spec with no uncertainty", () => {
    expect(verdict({ value: 2.0978, min: 2.0978, max: 2.0988 })).toBe("in_spec");
    expect(verdict({ value: 2.0988, min: 2.0978, max: 2.0988 })).toBe("in_spec");
    expect(verdict({ value: 2.0977, min: 2.0978, max: 2.0988 })).toBe("out_of_spec");
    expect(verdict({ value: 2.0989, min: 2.0978, max: 2.0988 })).toBe("out_of_spec");
  });
});

describe("exact at every limit edge, metric", () => {
  it("100.025 − 100.000 on a 0.025 mm max is in spec (the double is 0.025000000000005684)", () => {
    expect(100.025 - 100).toBeGreaterThan(0.025);
    expect(verdict({ value: 100.025 - 100, max: 0.025 })).toBe("in_spec");
    expect(verdict({ value: 100.026 - 100, max: 0.025 })).toBe("out_of_spec");
  });
  it("65.011 − 64.986 on a 0.025 mm min is in spec (the double is 0.02499999…)", () => {
    expect(65.011 - 64.986).toBeLessThan(0.025);
    expect(verdict({ value: 65.011 - 64.986, min: 0.025, max: 0.05 })).toBe("in_spec");
    expect(verdict({ value: 65.01 - 64.986, min: 0.025, max: 0.05 })).toBe("out_of_spec");
  });
  it("ISO 286 50 H7 limits 50.000/50.025 hold at both edges", () => {
    // ISO 286-2:2010, H7 over 30 up to 50 mm: 0/+25 µm
    expect(verdict({ value: 50 + 0.025, min: 50, max: 50.025 })).toBe("in_spec");
    expect(verdict({ value: 50.026, min: 50, max: 50.025 })).toBe("out_of_spec");
    expect(verdict({ value: 49.999, min: 50, max: 50.025 })).toBe("out_of_spec");
  });
});

describe("guard band of U (ISO 14253-1:2017, 5.2 conformance and 5.3 non-conformance)", () => {
  const zone = { min: 0.0015, max: 0.0025 };
  it("two-sided: zone edge in spec, inside the band marginal, on the limit marginal, beyond out", () => {
    const U = 0.0002;
    expect(verdict({ ...zone, value: 0.0017, uncertainty: U })).toBe("in_spec"); // lower zone edge
    expect(verdict({ ...zone, value: 0.0023, uncertainty: U })).toBe("in_spec"); // upper zone edge
    expect(verdict({ ...zone, value: 0.0016, uncertainty: U })).toBe("marginal");
    expect(verdict({ ...zone, value: 0.0024, uncertainty: U })).toBe("marginal");
    expect(verdict({ ...zone, value: 0.0015, uncertainty: U })).toBe("marginal");
    expect(verdict({ ...zone, value: 0.0025, uncertainty: U })).toBe("marginal");
    expect(verdict({ ...zone, value: 0.0026, uncertainty: U })).toBe("out_of_spec");
    expect(verdict({ ...zone, value: 0.0014, uncertainty: U })).toBe("out_of_spec");
  });
  it("metric, with the zone edge reached through float sums", () => {
    // 0.025 mm max with U = 0.002 mm: 0.023 is the zone edge, 0.0231 is marginal
    expect(verdict({ value: 100.023 - 100, max: 0.025, uncertainty: 0.002 })).toBe("in_spec");
    expect(verdict({ value: 100.0231 - 100, max: 0.025, uncertainty: 0.002 })).toBe("marginal");
  });
  it("max-only (taper, out-of-round) and min-only limits", () => {
    const U = 0.0002;
    expect(verdict({ value: 0.0008, max: 0.001, uncertainty: U })).toBe("in_spec");
    expect(verdict({ value: 0.0009, max: 0.001, uncertainty: U })).toBe("marginal");
    expect(verdict({ value: 0.001, max: 0.001, uncertainty: U })).toBe("marginal");
    expect(verdict({ value: 0.0011, max: 0.001, uncertainty: U })).toBe("out_of_spec");
    expect(verdict({ value: 0, max: 0.001 })).toBe("in_spec");
    expect(verdict({ value: 0.0042, min: 0.004, uncertainty: U })).toBe("in_spec");
    expect(verdict({ value: 0.0041, min: 0.004, uncertainty: U })).toBe("marginal");
    expect(verdict({ value: 0.0039, min: 0.004, uncertainty: U })).toBe("out_of_spec");
    expect(verdict({ value: 12, min: 0.004 })).toBe("in_spec");
  });
  it("a U wider than half the tolerance leaves no in-spec reading", () => {
    expect(conformanceZone(zone, 0.0006).empty).toBe(true);
    expect(verdict({ ...zone, value: 0.002, uncertainty: 0.0006 })).toBe("marginal");
  });
  it(`${p23.id}: every measured value of the published guard-band case`, () => {
    // ISO 14253-1:2017 + ILAC-G8:09/2019 4.2.3 (from the shared check values; 'conditional fail' → out_of_spec)
    const { LSL, USL, U_k2, measured } = p23.inputs;
    const got = measured.value.map((value) =>
      verdict({ value, min: LSL.value, max: USL.value, uncertainty: U_k2.value }),
    );
    expect(got).toEqual(p23.expected.state_3);
    const cz = conformanceZone({ min: LSL.value, max: USL.value }, U_k2.value);
    expect([cz.min, cz.max]).toEqual(p23.expected.conformance_zone.value);
    expect(cz.empty).toBe(false);
  });
});

describe("bad input says what to fix", () => {
  it.each([
    [{ value: 1 }, /at least one limit/],
    [{ value: 1, min: 2, max: 1 }, /swap them/],
    [{ value: 1, max: 2, uncertainty: -0.1 }, /cannot be negative/],
    [{ value: Number.NaN, max: 2 }, /finite number/],
    [{ value: 1, max: Number.POSITIVE_INFINITY }, /finite number/],
  ])("%o", (input, message) => {
    expect(() => verdict(input)).toThrow(message);
  });
  it("treats null limits (as a database gives them) as absent", () => {
    expect(verdict({ value: 0.0009, min: null, max: 0.001, uncertainty: null })).toBe("in_spec");
  });
});

// Values are whole tenths (n / 10 000 in), as a gauge gives them.
const tenths = fc.integer({ min: 0, max: 60000 });
const asIn = (n: number) => n / 10000;

describe("invariants (fast-check)", () => {
  it("a verdict never gets better when U grows", () => {
    fc.assert(
      fc.property(tenths, tenths, tenths, fc.nat(200), fc.nat(200), (v, a, b, u1, du) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        const at = (u: number) => RANK[verdict({ value: asIn(v), min: asIn(lo), max: asIn(hi), uncertainty: asIn(u) })];
        return at(u1 + du) >= at(u1);
      }),
    );
  });
  it("mirror symmetry: a value the same distance below the low limit as another is above the high one gets the same verdict", () => {
    fc.assert(
      fc.property(tenths, tenths, tenths, fc.nat(200), (v, a, b, u) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        const mirrored = lo + hi - v; // reflected about the middle of the tolerance
        const limits = { min: asIn(lo), max: asIn(hi), uncertainty: asIn(u) };
        return verdict({ ...limits, value: asIn(v) }) === verdict({ ...limits, value: asIn(mirrored) });
      }),
    );
  });
  it("a max-only limit behaves as the negated min-only limit", () => {
    fc.assert(
      fc.property(
        tenths,
        tenths,
        fc.nat(200),
        (v, m, u) =>
          verdict({ value: asIn(v), max: asIn(m), uncertainty: asIn(u) }) ===
          verdict({ value: -asIn(v), min: -asIn(m), uncertainty: asIn(u) }),
      ),
    );
  });
  it("the verdict does not depend on the unit system (1 in = 25.4 mm exactly, NIST SP 811 B.8)", () => {
    fc.assert(
      fc.property(tenths, tenths, tenths, fc.nat(200), (v, a, b, u) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        const inch = verdict({ value: asIn(v), min: asIn(lo), max: asIn(hi), uncertainty: asIn(u) });
        const mm = (n: number) => asIn(n) * 25.4;
        return inch === verdict({ value: mm(v), min: mm(lo), max: mm(hi), uncertainty: mm(u) });
      }),
    );
  });
});

describe("deviation from nominal", () => {
  it("is exact to the gauge's figures", () => {
    expect(4.0312 - 4.0302).not.toBe(0.001);
    expect(deviationFromNominal(4.0312, { nominal: 4.0302 })).toBe(0.001);
    expect(deviationFromNominal(99.988, { nominal: 100 })).toBe(-0.012);
  });
  it("uses the middle of the tolerance without a nominal, and nothing for one-sided limits", () => {
    expect(deviationFromNominal(2.0986, { min: 2.0978, max: 2.0988 })).toBe(0.0003);
    expect(deviationFromNominal(0.0004, { max: 0.001 })).toBeUndefined();
    expect(deviationFromNominal(0.0042, { min: 0.004 })).toBeUndefined();
  });
});

describe("formatDeviation in the bench's words", () => {
  it.each([
    [0.0003, "in", "3 tenths over"],
    [-0.0001, "in", "1 tenth under"],
    [0.00025, "in", "2.5 tenths over"],
    [-0.00025, "in", "2.5 tenths under"],
    [2.2022 - 2.2 - 0.0022, "in", "on nominal"], // float noise is not a deviation
    [-0.012, "mm", "12 µm under"],
    [0.0125, "mm", "12.5 µm over"],
    [0.001, "mm", "1 µm over"],
    [0, "mm", "on nominal"],
    [2, "lbf_ft", "2 lbf·ft over"],
    [-1.5, "nm", "1.5 N·m under"],
  ] as const)("%d %s → %s", (dev, unit, words) => {
    expect(formatDeviation(dev, unit)).toBe(words);
  });
  it("refuses an unknown unit", () => {
    expect(() => formatDeviation(1, "furlong" as never)).toThrow(/Unknown unit/);
  });
});
