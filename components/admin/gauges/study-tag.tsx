import { StatusTag } from "@/components/admin/status-tag";
import { studyStatus } from "@/lib/domain";
import type { LatestStudyLine } from "@/lib/schemas/gauge-study-overview";

// A gauge's latest study on the gauge list: none, current and passed, failed, or due again, in words
// and shape; the due date sits under the calibration's own.
export type StudyState = "none" | "passed" | "failed" | "due";

export function studyState(line: LatestStudyLine | undefined, today: string): StudyState {
  if (!line) return "none";
  if (studyStatus(line.summary, today) === "due") return "due";
  return line.passed ? "passed" : "failed";
}

const WORDS: Record<StudyState, string> = {
  none: "No study",
  passed: "Study passed",
  failed: "Study failed",
  due: "Study due",
};
const TONE = { none: "off", passed: "good", failed: "bad", due: "soon" } as const;

export function StudyTag({ state }: { state: StudyState }) {
  return <StatusTag tone={TONE[state]}>{WORDS[state]}</StatusTag>;
}
