// Whether a reading's gauge stood behind it as its latest study says: a study that fails for the
// reading's tolerance T (the same marks the study was judged by), or a reading taken after the
// study fell due, is a concern about the gauge like a calibration past due. Tablet and server ask
// this one rule.
import { capabilityFor, DEFAULT_STUDY_THRESHOLDS, type GaugeStudySummary } from "./gauge-studies";

export const GAUGE_STUDY_NOTES = ["gauge_study_failed", "gauge_study_due"] as const;
export type GaugeStudyNote = (typeof GAUGE_STUDY_NOTES)[number];

/** The spread a %GRR is taken over (6σ, common practice), as the core's R&R study takes it by default. */
const GRR_SPREAD_SIGMAS = 6;

/** Why the study fails for a tolerance T in the gauge's unit, in words; empty when it passes. */
export function studyFailureReasons(study: GaugeStudySummary, resolution: number, tolerance: number): string[] {
  const marks = study.thresholds ?? DEFAULT_STUDY_THRESHOLDS;
  if (study.kind === "type1") {
    return capabilityFor({ sd: study.repeatSd, bias: study.bias }, resolution, tolerance, marks).reasons;
  }
  const pct = (100 * GRR_SPREAD_SIGMAS * (study.grrSd ?? study.repeatSd)) / tolerance;
  return pct > marks.maxGrrPct
    ? [
        `Its R&R study's %GRR is ${pct.toFixed(1)} % of a tolerance of ${tolerance}; at most ${marks.maxGrrPct} % will do.`,
      ]
    : [];
}

/**
 * The concern about a reading's gauge from its latest study: failed for this tolerance (when the
 * limits give one: upper − lower, in the gauge's unit), else due when the reading was taken (YYYY-MM-DD)
 * after the study's due date; null without a study or when neither holds.
 */
export function gaugeStudyConcern(
  study: GaugeStudySummary | null | undefined,
  resolution: number,
  tolerance: number | undefined,
  takenOn: string,
): GaugeStudyNote | null {
  if (!study) return null;
  if (tolerance !== undefined && tolerance > 0 && Number.isFinite(tolerance)) {
    if (studyFailureReasons(study, resolution, tolerance).length > 0) return "gauge_study_failed";
  }
  return takenOn > study.dueOn ? "gauge_study_due" : null;
}
