// The flag a reading's gauge earns from its latest study: the rule itself is studyProblem
// (gauge-studies/study-problem.ts), which the release checklist and the build record ask too;
// here it is only named as the upload's flag reasons.
import { studyProblem, type GaugeStudySummary } from "./gauge-studies";

export const GAUGE_STUDY_NOTES = ["gauge_study_failed", "gauge_study_due"] as const;
export type GaugeStudyNote = (typeof GAUGE_STUDY_NOTES)[number];

/**
 * The flag reason for a reading taken on `takenOn` (YYYY-MM-DD) with a gauge whose latest study is
 * `study`: past due on that day, or failing for the reading's tolerance T (upper − lower, in the
 * gauge's unit; undefined for a one-sided limit); null without a study or when neither holds.
 */
export function gaugeStudyConcern(
  study: GaugeStudySummary | null | undefined,
  resolution: number,
  tolerance: number | undefined,
  takenOn: string,
): GaugeStudyNote | null {
  const problem = studyProblem(study, { resolution, tolerance: tolerance ?? null, takenOn });
  if (!problem) return null;
  return problem.kind === "failed" ? "gauge_study_failed" : "gauge_study_due";
}
