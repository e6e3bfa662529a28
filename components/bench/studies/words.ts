import type { StudyKind } from "@/lib/offline/study-draft-shape";

/** Our names for the two studies, on every tablet screen. */
export const STUDY_KIND_WORDS: Record<StudyKind, string> = {
  type1: "Repeatability run",
  grr: "R&R study",
};

export const STUDY_KIND_HINTS: Record<StudyKind, string> = {
  type1: "One person reads a setting master 25 to 50 times: spread and bias against the tolerances the gauge judges",
  grr: "2 or 3 people measure 5 to 10 parts 2 or 3 times each: how much of the spread is the gauge and the people",
};
