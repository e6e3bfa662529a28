import fCdf from "@stdlib/stats-base-dists-f-cdf";
import * as ss from "simple-statistics";
import { describe, expect, it } from "vitest";
import { checkGrrDesign, grrAnova, type GrrMeasurement } from "../../../../lib/domain";
import { AIAG_MSA4_GRR } from "./datasets";

/** A table of appraiser × trial rows of part figures as the core's measurements. */
function measurementsOf(table: number[][][]): GrrMeasurement[] {
  return table.flatMap((trials, a) =>
    trials.flatMap((parts, t) => parts.map((value, p) => ({ appraiser: a + 1, part: p + 1, trial: t + 1, value }))),
  );
}

const aiag = measurementsOf(AIAG_MSA4_GRR);
const rowOf = (r: ReturnType<typeof grrAnova>, source: string) => r.anova.find((x) => x.source === source)!;

/** The AIAG data with a made-up appraiser × part interaction added, so it is not pooled. */
const withInteraction = aiag.map((m) => ({ ...m, value: m.value + (m.appraiser === 2 && m.part % 2 === 0 ? 0.4 : 0) }));

describe("grrAnova", () => {
  it("gives the published ANOVA table of the AIAG example", () => {
    // AIAG MSA 4th ed., ANOVA method example (table III-B 5): df, SS, MS and F to the places printed
    const r = grrAnova({ measurements: aiag, keepInteraction: true });
    expect(r.interactionPooled).toBe(false);
    const printed = [
      ["part", 9, 88.3619, 9.81799, 492.291],
      ["appraiser", 2, 3.1673, 1.58363, 79.406],
      ["interaction", 18, 0.359, 0.01994, 0.434],
      ["repeatability", 60, 2.7589, 0.04598, null],
      ["total", 89, 94.6471, null, null],
    ] as const;
    for (const [source, df, sumSq, ms, f] of printed) {
      const got = rowOf(r, source);
      expect(got.df).toBe(df);
      expect(got.ss).toBeCloseTo(sumSq, 4);
      if (ms !== null) expect(got.ms).toBeCloseTo(ms, 5);
      if (f === null) expect(got.f).toBeNull();
      else expect(got.f).toBeCloseTo(f, f > 10 ? 1 : 3);
    }
  });

  it("pools the AIAG example's interaction (F = 0.434, p = 0.974 > 0.25, common practice)", () => {
    // p = 0.974 of the interaction as published for this data (from memory), and by @stdlib's F distribution
    const full = grrAnova({ measurements: aiag, keepInteraction: true });
    expect(rowOf(full, "interaction").p).toBeCloseTo(0.974, 3);
    expect(rowOf(full, "interaction").p).toBeCloseTo(1 - fCdf(rowOf(full, "interaction").f!, 18, 60), 7);
    const r = grrAnova({ measurements: aiag });
    expect(r.interactionPooled).toBe(true);
    expect(r.anova.map((x) => x.source)).toEqual(["part", "appraiser", "repeatability", "total"]);
    // Pooled repeatability = interaction 0.3590 + equipment 2.7589 over 18 + 60 degrees of freedom
    expect(rowOf(r, "repeatability").df).toBe(78);
    expect(rowOf(r, "repeatability").ss).toBeCloseTo(3.1179, 4);
    expect(rowOf(r, "repeatability").ms).toBeCloseTo(0.03997, 5);
    expect(rowOf(r, "part").f).toBeCloseTo(rowOf(r, "part").ms / rowOf(r, "repeatability").ms, 10);
  });

  it("splits the AIAG example's variation as published with the interaction pooled", () => {
    // Variance components of the AIAG data with the interaction pooled (α = 0.25), as commonly
    // published for it: repeatability 0.03997, reproducibility 0.05146, GRR 0.09143, part 1.08647;
    // %study variation GRR 27.86, repeatability 18.42, reproducibility 20.90, part 96.04; ndc 4.
    const r = grrAnova({ measurements: aiag, tolerance: 10 });
    expect(r).toMatchObject({ appraisers: 3, parts: 10, trials: 3, ndc: 4 });
    expect(r.sd.repeatability ** 2).toBeCloseTo(0.03997, 5);
    expect(r.sd.reproducibility ** 2).toBeCloseTo(0.05146, 5);
    expect(r.sd.interaction).toBe(0);
    expect(r.sd.grr ** 2).toBeCloseTo(0.09143, 5);
    expect(r.sd.part ** 2).toBeCloseTo(1.08647, 4);
    expect(r.pctStudyVariation).toBeCloseTo(27.86, 2);
    expect((100 * r.sd.repeatability) / r.sd.total).toBeCloseTo(18.42, 2);
    expect((100 * r.sd.reproducibility) / r.sd.total).toBeCloseTo(20.9, 2);
    expect((100 * r.sd.part) / r.sd.total).toBeCloseTo(96.04, 2);
    expect(r.pctTolerance).toBeCloseTo((100 * 6 * r.sd.grr) / 10, 12);
    expect(grrAnova({ measurements: aiag, tolerance: 10, spreadSigmas: 5.15 }).pctTolerance).toBeCloseTo(
      (100 * 5.15 * r.sd.grr) / 10,
      12,
    );
    expect(grrAnova({ measurements: aiag }).pctTolerance).toBeNull();
  });

  it("agrees with general-purpose statistics packages on sums of squares and F tests", () => {
    const r = grrAnova({ measurements: withInteraction });
    const values = withInteraction.map((m) => m.value);
    const grand = ss.mean(values);
    const groupSs = (key: "part" | "appraiser") => {
      const groups = [...new Set(withInteraction.map((m) => m[key]))].map((k) =>
        withInteraction.filter((m) => m[key] === k).map((m) => m.value),
      );
      return groups.reduce((sum, g) => sum + g.length * (ss.mean(g) - grand) ** 2, 0);
    };
    const cells = [...new Set(withInteraction.map((m) => `${m.appraiser}/${m.part}`))].map((k) =>
      withInteraction.filter((m) => `${m.appraiser}/${m.part}` === k).map((m) => m.value),
    );
    const within = cells.reduce((sum, c) => sum + ss.sumNthPowerDeviations(c, 2), 0);
    const total = ss.sumNthPowerDeviations(values, 2);
    // simple-statistics: deviations about group means; the interaction is what the rest leaves
    expect(rowOf(r, "part").ss).toBeCloseTo(groupSs("part"), 10);
    expect(rowOf(r, "appraiser").ss).toBeCloseTo(groupSs("appraiser"), 10);
    expect(rowOf(r, "repeatability").ss).toBeCloseTo(within, 10);
    expect(rowOf(r, "total").ss).toBeCloseTo(total, 10);
    expect(rowOf(r, "interaction").ss).toBeCloseTo(total - groupSs("part") - groupSs("appraiser") - within, 10);
    // @stdlib's F distribution: parts and appraisers against interaction, interaction against repeatability
    const ms = (s: string) => rowOf(r, s).ms;
    expect(rowOf(r, "part").f).toBeCloseTo(ms("part") / ms("interaction"), 10);
    expect(rowOf(r, "part").p).toBeCloseTo(1 - fCdf(ms("part") / ms("interaction"), 9, 18), 7);
    expect(rowOf(r, "appraiser").p).toBeCloseTo(1 - fCdf(ms("appraiser") / ms("interaction"), 2, 18), 7);
    const fInteraction = ms("interaction") / ms("repeatability");
    expect(rowOf(r, "interaction").f).toBeCloseTo(fInteraction, 10);
    expect(rowOf(r, "interaction").p).toBeCloseTo(1 - fCdf(fInteraction, 18, 60), 7);
    expect(rowOf(r, "interaction").p).toBeLessThan(0.25);
    // Expected mean squares of the random-effects model
    expect(r.sd.interaction ** 2).toBeCloseTo((ms("interaction") - ms("repeatability")) / 3, 12);
    expect(r.sd.appraiser ** 2).toBeCloseTo(Math.max(0, (ms("appraiser") - ms("interaction")) / 30), 12);
    expect(r.sd.part ** 2).toBeCloseTo((ms("part") - ms("interaction")) / 9, 12);
  });

  it("sets a negative variance component to 0", () => {
    // Appraisers agree better than the interaction spreads: MS appraiser < MS interaction
    const r = grrAnova({
      measurements: withInteraction.map((m) => ({ ...m, value: m.value - appraiserShift(m.appraiser) })),
    });
    expect(rowOf(r, "appraiser").ms).toBeLessThan(rowOf(r, "interaction").ms);
    expect(r.sd.appraiser).toBe(0);
  });

  it("refuses an unbalanced or out-of-range design in words", () => {
    const missing = aiag.filter((m) => !(m.appraiser === 2 && m.part === 4 && m.trial === 2));
    expect(checkGrrDesign(missing)).toEqual(["Appraiser 2, part 4 lacks trial 2: measure it."]);
    expect(checkGrrDesign([...aiag, aiag[0]])).toEqual([
      "Appraiser 1, part 1 has trial 1 more than once: keep one of each.",
    ]);
    const onePerson = aiag.filter((m) => m.appraiser === 1);
    expect(checkGrrDesign(onePerson)).toEqual(["An R&R study takes 2 to 3 appraisers; 1 were given."]);
    const fourParts = aiag.filter((m) => m.part <= 4);
    expect(checkGrrDesign(fourParts)).toEqual(["An R&R study takes 5 to 10 parts; 4 were given."]);
    const oneTrial = aiag.filter((m) => m.trial === 1);
    expect(checkGrrDesign(oneTrial)).toEqual(["An R&R study takes 2 to 3 trials; 1 were given."]);
    expect(checkGrrDesign([{ ...aiag[0], value: Number.NaN }, ...aiag.slice(1)])).toEqual([
      "Appraiser 1, part 1, trial 1 is not a number: measure it again.",
    ]);
    expect(checkGrrDesign([{ ...aiag[0], part: 0 }])[0]).toMatch(/whole numbers from 1/);
    expect(() => grrAnova({ measurements: missing })).toThrow(/lacks trial 2/);
    expect(() => grrAnova({ measurements: aiag, tolerance: 0 })).toThrow(/tolerance must be above zero/);
  });

  it("says so, without dividing, when the measurements show no spread at all", () => {
    const flat = aiag.map((m) => ({ ...m, value: m.part }));
    expect(() => grrAnova({ measurements: flat })).toThrow(/no measurement spread/);
  });
});

/** Shifts that bring the appraisers' averages together. */
function appraiserShift(appraiser: number): number {
  const means = [1, 2, 3].map((a) => ss.mean(withInteraction.filter((m) => m.appraiser === a).map((m) => m.value)));
  return means[appraiser - 1] - ss.mean(means);
}
