import { describe, expect, it } from "vitest";
import { commonPracticeMarks } from "@/lib/schemas/common-practice";
import type { LimitValues } from "@/lib/schemas/spec";

const gap = (v: Partial<LimitValues> = {}): LimitValues => ({
  characteristic: "ring_end_gap",
  stationPattern: "ring-gap/*/top",
  limitType: "min_max",
  unit: "in",
  min: 0.016,
  max: 0.02,
  required: true,
  commonPractice: true,
  ...v,
});
const lash = gap({ characteristic: "valve_lash", stationPattern: "lash/*/int", min: 0.012, max: 0.014 });

describe("commonPracticeMarks", () => {
  it("takes a new sheet's marks as the limits say (a starter sheet, an exported one imported again)", () => {
    expect(commonPracticeMarks([gap(), gap({ commonPractice: false })], null)).toEqual([true, false]);
  });

  it("keeps the mark where the figures are unchanged, even with a new label, gauge or 'required'", () => {
    const edited = gap({ label: "Top ring", gaugeKind: "feeler", required: false, commonPractice: undefined });
    expect(commonPracticeMarks([edited, lash], [gap(), lash])).toEqual([true, true]);
  });

  it("takes the mark off a limit whose figures, type or unit changed, and only that one", () => {
    expect(commonPracticeMarks([gap({ max: 0.021 }), lash], [gap(), lash])).toEqual([false, true]);
    expect(commonPracticeMarks([gap({ limitType: "max_only" })], [gap()])).toEqual([false]);
    expect(commonPracticeMarks([gap({ unit: "mm", min: 0.4, max: 0.5 })], [gap()])).toEqual([false]);
  });

  it("ignores a figure left over from another limit type (it is not stored)", () => {
    expect(commonPracticeMarks([gap({ nominal: 4.03 })], [gap()])).toEqual([true]);
  });

  it("lets the lead take a mark off without changing a figure, but never put one back", () => {
    expect(commonPracticeMarks([gap({ commonPractice: false })], [gap()])).toEqual([false]);
    expect(commonPracticeMarks([gap({ commonPractice: true })], [gap({ commonPractice: false })])).toEqual([false]);
    expect(commonPracticeMarks([gap({ stationPattern: "ring-gap/1/top" })], [gap()])).toEqual([false]);
  });
});
