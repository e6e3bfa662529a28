// Whether a gauge's latest study stands behind one reading: the ONE rule the upload's flags, the
// release checklist and the build record ask, so they never disagree. A gauge without a study is
// judged by its certificate alone (no problem here); a study past its due date on the day the reading
// was taken stands no more, like a calibration; a study that fails for the reading's tolerance T
// (the job's limits, in the gauge's unit) says the gauge is not good enough for it.
import { DEFAULT_STUDY_THRESHOLDS } from "./thresholds";
import { capabilityFor } from "./type1";
import { unitWords } from "../words";
import type { GaugeStudySummary } from "./types";
import { measureFigure, percentFigure } from "./words";

export type StudyProblemKind = "overdue" | "failed";
export interface StudyProblem {
  kind: StudyProblemKind;
  /** Words about the gauge's study, to follow the gauge's name ("Bore gauge 2 …"). */
  words: string;
}

export interface StudyUse {
  /** The gauge's smallest step, in the gauge's unit. */
  resolution: number;
  /** The reading's tolerance T = upper − lower limit in the gauge's unit; null for a one-sided limit. */
  tolerance: number | null;
  /** The day (YYYY-MM-DD, UTC) the reading was taken. */
  takenOn: string;
  /** The gauge's unit, to name beside the tolerance in the words. */
  unit?: string;
}

const KIND_WORDS = { type1: "repeatability study", grr: "R&R study" } as const;

export function studyProblem(study: GaugeStudySummary | null | undefined, use: StudyUse): StudyProblem | null {
  if (!study) return null;
  const name = `${KIND_WORDS[study.kind]} of ${study.performedOn}`;
  if (use.takenOn > study.dueOn) {
    return { kind: "overdue", words: `was past its ${name}'s due date (${study.dueOn})` };
  }
  const T = use.tolerance;
  const tWords = (t: number) => `${measureFigure(t)}${use.unit ? ` ${unitWords(use.unit)}` : ""}`;
  // Capability needs a two-sided tolerance; a one-sided limit has no T to hold the spread against.
  if (T === null || !(T > 0) || !Number.isFinite(T)) return null;
  const marks = study.thresholds ?? DEFAULT_STUDY_THRESHOLDS;
  if (study.kind === "grr") {
    const sd = study.grrSd ?? study.repeatSd;
    // 6 σ as the spread, the core's default for %GRR of the tolerance (common practice).
    const pct = (100 * 6 * sd) / T;
    if (pct <= marks.maxGrrPct) return null;
    return {
      kind: "failed",
      words:
        `fails its ${name} for a tolerance of ${tWords(T)}: %GRR ${percentFigure(pct)} of T, ` +
        `at most ${percentFigure(marks.maxGrrPct)} will do`,
    };
  }
  const capability = capabilityFor({ sd: study.repeatSd, bias: study.bias }, use.resolution, T, marks);
  if (capability.pass) return null;
  return {
    kind: "failed",
    words: `fails its ${name} for a tolerance of ${tWords(T)}: ${capability.reasons[0].replace(/\.$/, "")}`,
  };
}
