// The concern a gauge's latest study raises about a reading. The formulas are the issue's own
// (Cg = 0.2·T/(6·s), Cgk = (0.1·T − |bias|)/(3·s), resolution ≤ 5 % of T, %GRR = 100·6·σ_GRR/T,
// marks 1.33 / 5 % / 30 %: common practice); the figures are invented.
import { describe, expect, it } from "vitest";
import { gaugeStudyConcern, studyProblem, type GaugeStudySummary } from "@/lib/domain";

const type1 = (repeatSd: number, bias = 0, dueOn = "2027-06-01"): GaugeStudySummary => ({
  kind: "type1",
  performedOn: "2026-06-01",
  dueOn,
  repeatSd,
  bias,
});

describe("gaugeStudyConcern", () => {
  it("no study: no concern", () => {
    expect(gaugeStudyConcern(null, 0.00001, 0.001, "2026-12-01")).toBeNull();
  });

  it("passes when Cg and Cgk reach 1.33 and the step is within 5 % of T", () => {
    // T = 0.001: Cg = 0.0002/(6·0.00002) = 1.67, Cgk = (0.0001 − 0)/(0.00006) = 1.67.
    expect(gaugeStudyConcern(type1(0.00002), 0.00001, 0.001, "2026-12-01")).toBeNull();
  });

  it("fails when the spread is too wide for T (Cg = 0.0002/(6·0.00003) = 1.11 < 1.33)", () => {
    expect(gaugeStudyConcern(type1(0.00003), 0.00001, 0.001, "2026-12-01")).toBe("gauge_study_failed");
    const use = { resolution: 0.00001, tolerance: 0.001, takenOn: "2026-12-01" };
    expect(studyProblem(type1(0.00003), use)?.words).toMatch(/Cg 1\.1/);
  });

  it("the same study passes a wider tolerance: the concern is per T", () => {
    expect(gaugeStudyConcern(type1(0.00003), 0.00001, 0.002, "2026-12-01")).toBeNull();
  });

  it("fails on bias alone (Cgk = (0.0001 − 0.00006)/(0.00006) = 0.67)", () => {
    expect(gaugeStudyConcern(type1(0.00002, 0.00006), 0.00001, 0.001, "2026-12-01")).toBe("gauge_study_failed");
  });

  it("fails on a step past 5 % of T (0.0001 of 0.001 is 10 %)", () => {
    expect(gaugeStudyConcern(type1(0.00001), 0.0001, 0.001, "2026-12-01")).toBe("gauge_study_failed");
  });

  it("judges by the marks the study was saved with", () => {
    const lenient = {
      ...type1(0.00003),
      thresholds: { minCg: 1, minCgk: 1, maxResolutionPct: 10, maxGrrPct: 30, validMonths: 12 },
    };
    expect(gaugeStudyConcern(lenient, 0.00001, 0.001, "2026-12-01")).toBeNull();
  });

  it("an R&R study fails when 6·σ_GRR is more than 30 % of T", () => {
    const grr = (grrSd: number): GaugeStudySummary => ({ ...type1(grrSd / 2), kind: "grr", grrSd });
    expect(gaugeStudyConcern(grr(0.00005), 0.00001, 0.001, "2026-12-01")).toBeNull(); // 30 %: on the mark
    expect(gaugeStudyConcern(grr(0.00006), 0.00001, 0.001, "2026-12-01")).toBe("gauge_study_failed"); // 36 %
  });

  it("a reading taken after the due date is due; on the due date it is not", () => {
    expect(gaugeStudyConcern(type1(0.00002), 0.00001, 0.001, "2027-06-01")).toBeNull();
    expect(gaugeStudyConcern(type1(0.00002), 0.00001, 0.001, "2027-06-02")).toBe("gauge_study_due");
  });

  it("a one-sided limit (no T) is judged by the due date only", () => {
    expect(gaugeStudyConcern(type1(0.001), 0.0001, undefined, "2026-12-01")).toBeNull();
  });
});
