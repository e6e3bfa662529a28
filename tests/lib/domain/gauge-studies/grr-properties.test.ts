import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { grrAnova, type GrrMeasurement } from "../../../../lib/domain";

// Random balanced designs (2–3 appraisers, 5–10 parts, 2–3 trials) of invented figures.
const design = fc
  .record({ a: fc.integer({ min: 2, max: 3 }), b: fc.integer({ min: 5, max: 10 }), r: fc.integer({ min: 2, max: 3 }) })
  .chain(({ a, b, r }) =>
    fc.array(fc.integer({ min: -1000, max: 1000 }), { minLength: a * b * r, maxLength: a * b * r }).map((xs) => {
      const ms: GrrMeasurement[] = [];
      let i = 0;
      for (let o = 1; o <= a; o++)
        for (let p = 1; p <= b; p++)
          for (let t = 1; t <= r; t++) ms.push({ appraiser: o, part: p, trial: t, value: xs[i++] / 1000 });
      return ms;
    }),
  );

/** Whether some appraiser's trials of some part differ (else the study has no spread to judge and refuses). */
function repeatsDiffer(ms: GrrMeasurement[]): boolean {
  const first = new Map<string, number>();
  return ms.some((m) => {
    const key = `${m.appraiser}/${m.part}`;
    if (!first.has(key)) first.set(key, m.value);
    return first.get(key) !== m.value;
  });
}

describe("grrAnova (properties)", () => {
  it("its sums of squares add up to the total; no spread is negative; GRR is within the total", () => {
    // The ANOVA identity of a balanced two-way crossed design: SS_total = SS_part + SS_appraiser + SS_int + SS_E
    fc.assert(
      fc.property(design, (ms) => {
        fc.pre(repeatsDiffer(ms));
        const r = grrAnova({ measurements: ms, keepInteraction: true });
        const ss = (s: string) => r.anova.find((x) => x.source === s)!.ss;
        const parts = ss("part") + ss("appraiser") + ss("interaction") + ss("repeatability");
        expect(parts).toBeCloseTo(ss("total"), 9);
        for (const v of Object.values(r.sd)) expect(v).toBeGreaterThanOrEqual(0);
        expect(r.sd.grr).toBeLessThanOrEqual(r.sd.total * (1 + 1e-12));
        expect(r.ndc).toBeGreaterThanOrEqual(1);
      }),
      { numRuns: 60 },
    );
  });

  it("does not move when every figure is shifted by one amount (a different zero)", () => {
    fc.assert(
      fc.property(design, fc.integer({ min: -100_000, max: 100_000 }), (ms, shift) => {
        fc.pre(repeatsDiffer(ms));
        const before = grrAnova({ measurements: ms });
        const after = grrAnova({ measurements: ms.map((m) => ({ ...m, value: m.value + shift })) });
        expect(after.interactionPooled).toBe(before.interactionPooled);
        expect(after.sd.grr).toBeCloseTo(before.sd.grr, 9);
        expect(after.sd.part).toBeCloseTo(before.sd.part, 9);
      }),
      { numRuns: 60 },
    );
  });
});
