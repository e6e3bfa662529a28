import { describe, expect, it } from "vitest";
import { DEFAULT_STUDY_THRESHOLDS, studyDueOn, studyStatus, type GaugeStudySummary } from "../../../../lib/domain";

const summary: GaugeStudySummary = {
  kind: "type1",
  performedOn: "2026-01-31",
  dueOn: "2027-01-31",
  repeatSd: 0.001,
  bias: 0,
};

describe("study thresholds and due dates", () => {
  it("defaults to Cg and Cgk 1.33, 5 % resolution, 30 % GRR, a year (common practice)", () => {
    expect(DEFAULT_STUDY_THRESHOLDS).toEqual({
      minCg: 1.33,
      minCgk: 1.33,
      maxResolutionPct: 5,
      maxGrrPct: 30,
      validMonths: 12,
    });
  });

  it("falls due whole months later, on the month's last day when the day is missing", () => {
    expect(studyDueOn("2026-01-31", 12)).toBe("2027-01-31");
    expect(studyDueOn("2026-01-31", 1)).toBe("2026-02-28");
    expect(studyDueOn("2027-11-30", 3)).toBe("2028-02-29");
    expect(studyDueOn("2026-06-15", 6)).toBe("2026-12-15");
    expect(() => studyDueOn("2026-02-30", 12)).toThrow(/YYYY-MM-DD/);
    expect(() => studyDueOn("2026-02-01", 0)).toThrow(/whole number of months/);
  });

  it("is current through its due date and due the day after, like a calibration", () => {
    expect(studyStatus(undefined, "2026-05-01")).toBe("none");
    expect(studyStatus(summary, "2027-01-31")).toBe("current");
    expect(studyStatus(summary, "2027-02-01")).toBe("due");
    expect(studyStatus(summary, new Date("2027-02-01T00:30:00Z"))).toBe("due");
  });
});
