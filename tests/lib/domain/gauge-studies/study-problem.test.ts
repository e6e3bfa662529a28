import { describe, expect, it } from "vitest";
import { DEFAULT_STUDY_THRESHOLDS, studyProblem, type GaugeStudySummary } from "@/lib/domain";

// Invented demo studies. The indices are the formulas, worked by hand:
// Cg = 0.2·T/(6·s), Cgk = (0.1·T − |bias|)/(3·s); pass marks 1.33 (common practice).
const type1: GaugeStudySummary = {
  kind: "type1",
  performedOn: "2026-06-01",
  dueOn: "2027-06-01",
  repeatSd: 0.0001,
  bias: 0,
};
const use = (tolerance: number | null, takenOn = "2026-12-01") => ({ resolution: 0.0001, tolerance, takenOn });

describe("studyProblem", () => {
  it("has nothing to say without a study: the certificate alone stands", () => {
    expect(studyProblem(null, use(0.002))).toBeNull();
    expect(studyProblem(undefined, use(0.002))).toBeNull();
  });

  it("passes a wide tolerance: T = 0.01, s = 0.0001 gives Cg = Cgk = 3.33, step 1 % of T", () => {
    expect(studyProblem(type1, use(0.01))).toBeNull();
  });

  it("fails a tight one: T = 0.002, s = 0.0001 gives Cg = 0.0004/0.0006 = 0.67, below 1.33", () => {
    const p = studyProblem(type1, use(0.002));
    expect(p?.kind).toBe("failed");
    expect(p?.words).toMatch(
      /^fails its repeatability study of 2026-06-01 for a tolerance of 0\.002: Cg 0\.67 is below 1\.33/,
    );
    expect(p?.words).not.toMatch(/\.$/);
    expect(studyProblem(type1, { ...use(0.002), unit: "in" })?.words).toMatch(/for a tolerance of 0\.002 in: Cg/);
  });

  it("counts the bias: T = 0.01, s = 0.0001, bias 0.0007 gives Cgk = (0.001 − 0.0007)/0.0003 = 1.00", () => {
    const p = studyProblem({ ...type1, bias: -0.0007 }, use(0.01));
    expect(p?.words).toMatch(/Cgk 1\.00 is below 1\.33/);
  });

  it("judges by the marks the study was saved with", () => {
    const lenient = { ...DEFAULT_STUDY_THRESHOLDS, minCg: 0.5, minCgk: 0.5 };
    // Cg = Cgk = 0.67 ≥ 0.5 and the step is 0.0001/0.002 = 5 % of T, at the 5 % mark.
    expect(studyProblem({ ...type1, thresholds: lenient }, use(0.002))).toBeNull();
  });

  it("is overdue from the day after its due date, like a calibration", () => {
    expect(studyProblem(type1, use(0.01, "2027-06-01"))).toBeNull();
    const p = studyProblem(type1, use(0.01, "2027-06-02"));
    expect(p).toEqual({
      kind: "overdue",
      words: "was past its repeatability study of 2026-06-01's due date (2027-06-01)",
    });
  });

  it("cannot judge capability for a one-sided limit (no T) but still sees a due date", () => {
    expect(studyProblem(type1, use(null))).toBeNull();
    expect(studyProblem(type1, use(null, "2028-01-01"))?.kind).toBe("overdue");
  });

  it("holds an R&R study's 6·σ_GRR against T: 30 % passes at the 30 % mark, 33.3 % fails", () => {
    const grr: GaugeStudySummary = { ...type1, kind: "grr", repeatSd: 0.0004, grrSd: 0.0005 };
    expect(studyProblem(grr, use(0.01))).toBeNull();
    const p = studyProblem(grr, use(0.009));
    expect(p?.kind).toBe("failed");
    expect(p?.words).toMatch(/R&R study of 2026-06-01 .*%GRR 33\.3 % of T, at most 30 % will do$/);
  });
});
