// The fast decimal paths (lib/domain/scaled-figures.ts, verdict-fast.ts and their use in verdict.ts
// and units.ts) against the code they sped up (./decimal-before/, kept verbatim): the same numbers
// bit for bit (−0 and 0 told apart), the same words and the same errors, on random figures aimed
// at the hard cases — on a limit, on limit ± U, within 1e-12 of it, float noise, unit conversions,
// −0, huge and tiny sizes, one-sided limits, U = 0 or missing, NaN and Infinity.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { MeasureUnit } from "../../../lib/domain/enums";
import * as units from "../../../lib/domain/units";
import * as verdicts from "../../../lib/domain/verdict";
import * as unitsBefore from "./decimal-before/units";
import * as verdictsBefore from "./decimal-before/verdict";

type Outcome = { value: unknown } | { error: string };

function outcome(fn: () => unknown): Outcome {
  try {
    return { value: fn() };
  } catch (e) {
    return { error: (e as Error).message };
  }
}

/** Old and new answer alike: toStrictEqual compares numbers with Object.is, so −0 ≠ 0. */
function same(now: () => unknown, before: () => unknown) {
  expect(outcome(now)).toStrictEqual(outcome(before));
}

/** x moved by n units in the last place (the doubles next to a figure). */
function ulps(x: number, n: number): number {
  if (!Number.isFinite(x) || x === 0) return x;
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  view.setBigInt64(0, view.getBigInt64(0) + BigInt(n * Math.sign(x)));
  return view.getFloat64(0);
}

const LBF_FT_TO_NM = units.NM_PER_LBF_FT;
/** A shop figure: 0–6 decimals (inch work writes 4, metric 3, torque 0–1). */
const written = fc
  .tuple(fc.integer({ min: -2_000_000_000, max: 2_000_000_000 }), fc.integer({ min: 0, max: 6 }))
  .map(([n, places]) => n / 10 ** places);
/** Bench sizes: inch to the tenth, mm to the micrometre, torque to a tenth of a unit. */
const benchSize = fc.oneof(
  fc.integer({ min: 0, max: 120_000 }).map((n) => n / 10_000),
  fc.integer({ min: 0, max: 400_000 }).map((n) => n / 1000),
  fc.integer({ min: 0, max: 5000 }).map((n) => n / 10),
);
const converted = fc
  .tuple(benchSize, fc.constantFrom(25.4, 1 / 25.4, LBF_FT_TO_NM, 1 / LBF_FT_TO_NM, units.CC_PER_CUBIC_IN))
  .map(([x, f]) => (f < 1 ? x / (1 / f) : x * f));
// 4.0312 − 4.0302 is 0.0010000000000003 as a double.
const noise = fc.tuple(benchSize, benchSize, fc.boolean()).map(([a, b, plus]) => (plus ? a + b : a - b));
const special = fc.constantFrom(
  0,
  -0,
  5e-324,
  -5e-324,
  1e-300,
  1e-15,
  1e-12,
  1e-7,
  0.1 + 0.2,
  999_999_999_999.5,
  1e12,
  1e15 + 0.25,
  1e21,
  1e300,
  -1e300,
  Number.MAX_VALUE,
);
/** Just beside a 12-digit decimal: the edge of the fast paths' own test (0.5e-12 relative). */
const besideTwelveDigits = fc
  .tuple(
    fc.integer({ min: 100_000_000_000, max: 999_999_999_999 }),
    fc.integer({ min: 0, max: 24 }),
    fc.double({ min: -1.5e-12, max: 1.5e-12, noNaN: true }),
    fc.boolean(),
  )
  .map(([n, k, rel, negative]) => (negative ? -1 : 1) * (n / 10 ** k) * (1 + rel));
const bad = fc.constantFrom(NaN, Infinity, -Infinity);
const figure = fc.oneof(
  { arbitrary: written, weight: 4 },
  { arbitrary: benchSize, weight: 4 },
  { arbitrary: converted, weight: 3 },
  { arbitrary: noise, weight: 3 },
  { arbitrary: besideTwelveDigits, weight: 2 },
  { arbitrary: special, weight: 1 },
  { arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }), weight: 1 },
  { arbitrary: bad, weight: 1 },
);
/** A figure next to `x`: on it, a few ulps off, within 1e-12 of it, or off by float noise. */
function near(x: number) {
  return fc.oneof(
    fc.constant(x),
    fc.integer({ min: -4, max: 4 }).map((n) => ulps(x, n)),
    fc
      .constantFrom(1e-13, 4e-13, 5e-13, 6e-13, 1e-12, 5e-12, 1e-11, 1e-9)
      .chain((rel) => fc.constantFrom(x * (1 + rel), x * (1 - rel), x + rel, x - rel)),
    fc.constantFrom(0.0001, 0.001, 1).map((step) => x + 4.0312 - 4.0302 - step * 0.001),
  );
}
const maybe = (arb: fc.Arbitrary<number>) =>
  fc.oneof({ arbitrary: arb, weight: 4 }, fc.constant(undefined), fc.constant(null));
const uncertainty = fc.oneof(
  fc.constant(0),
  fc.integer({ min: 0, max: 50 }).map((n) => n / 10_000),
  fc.integer({ min: 0, max: 20 }).map((n) => n / 1000),
  figure.map(Math.abs),
  figure,
);

/** Limits (mostly in order, sometimes swapped), U, and a value aimed at a limit or its guard band. */
const verdictCase = fc
  .tuple(maybe(figure), maybe(figure), maybe(uncertainty), fc.boolean())
  .chain(([a, b, u, ordered]) => {
    const [min, max] = ordered && typeof a === "number" && typeof b === "number" && a > b ? [b, a] : [a, b];
    const band = typeof u === "number" ? u : 0;
    const targets = [min, max, (min ?? 0) + band, (max ?? 0) - band].filter((x) => typeof x === "number");
    const value = fc.oneof(figure, ...targets.map((t) => near(t as number)));
    return fc.record({ value, min: fc.constant(min), max: fc.constant(max), uncertainty: fc.constant(u) });
  });

const UNITS: MeasureUnit[] = ["in", "mm", "lbf_ft", "nm"];
const unit = fc.oneof({ arbitrary: fc.constantFrom(...UNITS), weight: 9 }, fc.constant("inch" as MeasureUnit));
const RUNS = { numRuns: 4000 };

describe("fast decimal paths give the old answers (property tests against decimal-before/)", () => {
  it("verdict, conformanceZone and deviationFromNominal", () => {
    fc.assert(
      fc.property(verdictCase, maybe(figure), (c, nominal) => {
        same(
          () => verdicts.verdict(c),
          () => verdictsBefore.verdict(c),
        );
        same(
          () => verdicts.conformanceZone(c, c.uncertainty as number),
          () => verdictsBefore.conformanceZone(c, c.uncertainty as number),
        );
        // Stored limits may carry null where a side is missing; the type says undefined.
        const limit = { min: c.min, max: c.max, nominal } as Parameters<typeof verdicts.deviationFromNominal>[1];
        same(
          () => verdicts.deviationFromNominal(c.value, limit),
          () => verdictsBefore.deviationFromNominal(c.value, limit),
        );
      }),
      RUNS,
    );
  });

  it("formatDeviation, of figures and of deviations from a nominal", () => {
    const halfway = fc
      .tuple(fc.integer({ min: -99_999, max: 99_999 }), fc.constantFrom(4, 5, 6))
      .map(([n, places]) => (n + 0.5) / 10 ** places);
    fc.assert(
      fc.property(fc.oneof(figure, halfway), benchSize, unit, (dev, nominal, u) => {
        same(
          () => verdicts.formatDeviation(dev, u),
          () => verdictsBefore.formatDeviation(dev, u),
        );
        const limit = { nominal };
        same(
          () => verdicts.formatDeviation(verdicts.deviationFromNominal(nominal + dev, limit) ?? 0, u),
          () => verdictsBefore.formatDeviation(verdictsBefore.deviationFromNominal(nominal + dev, limit) ?? 0, u),
        );
      }),
      RUNS,
    );
  });

  it("cleanDecimal and roundToResolution", () => {
    const halfway = fc
      .tuple(fc.integer({ min: -9_999_999, max: 9_999_999 }), fc.constantFrom(1, 3, 4, 5))
      .map(([n, places]) => (n + 0.5) / 10 ** places);
    fc.assert(
      fc.property(fc.oneof(figure, halfway), unit, (x, u) => {
        same(
          () => units.cleanDecimal(x),
          () => unitsBefore.cleanDecimal(x),
        );
        same(
          () => units.roundToResolution(x, u),
          () => unitsBefore.roundToResolution(x, u),
        );
      }),
      RUNS,
    );
  });

  it("decimalDifference and decimalSum", () => {
    const pair = fc.oneof(
      fc.tuple(figure, figure),
      figure.chain((a) => fc.tuple(fc.constant(a), near(a))),
    );
    fc.assert(
      fc.property(pair, fc.array(figure, { maxLength: 6 }), ([a, b], terms) => {
        same(
          () => units.decimalDifference(a, b),
          () => unitsBefore.decimalDifference(a, b),
        );
        same(
          () => units.decimalSum([a, -b, ...terms]),
          () => unitsBefore.decimalSum([a, -b, ...terms]),
        );
      }),
      RUNS,
    );
  });

  it("agrees on the named hard cases", () => {
    // 4.0312 − 4.0302 as doubles, a converted bore (4.0302 in in mm), a limit met exactly.
    const figures = [4.0312 - 4.0302, 4.0302 * 25.4, 102.36708 / 25.4, 0.001, -0, 0, 0.00045 * 4.0817, 1e-300];
    for (const x of figures) {
      for (const y of figures) {
        same(
          () => units.decimalDifference(x, y),
          () => unitsBefore.decimalDifference(x, y),
        );
        const c = { value: x, min: y, max: 4.0312, uncertainty: 0.0001 };
        same(
          () => verdicts.verdict(c),
          () => verdictsBefore.verdict(c),
        );
      }
      for (const u of UNITS) {
        same(
          () => verdicts.formatDeviation(x, u),
          () => verdictsBefore.formatDeviation(x, u),
        );
      }
    }
    expect(verdicts.verdict({ value: 4.0312 - 4.0302, max: 0.001 })).toBe("in_spec"); // on the limit, U = 0
    expect(units.decimalDifference(4.0312, 4.0302)).toBe(0.001);
  });
});
