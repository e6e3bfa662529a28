// A shop's pass marks for gauge studies and when a study falls due again.
import type { GaugeStudySummary, StudyThresholds } from "./types";

/** Common practice: Cg and Cgk at least 1.33, resolution at most 5 % of T, %GRR at most 30 %, yearly. */
export const DEFAULT_STUDY_THRESHOLDS: Readonly<StudyThresholds> = Object.freeze({
  minCg: 1.33,
  minCgk: 1.33,
  maxResolutionPct: 5,
  maxGrrPct: 30,
  validMonths: 12,
});

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

function parseDay(day: string, what: string): { y: number; m: number; d: number } {
  const match = ISO_DATE.exec(day);
  const [y, m, d] = match ? [Number(match[1]), Number(match[2]), Number(match[3])] : [0, 0, 0];
  const probe = new Date(Date.UTC(y, m - 1, d));
  if (!match || probe.getUTCFullYear() !== y || probe.getUTCMonth() !== m - 1 || probe.getUTCDate() !== d) {
    throw new Error(`${what} must be a date written YYYY-MM-DD; got "${day}"`);
  }
  return { y, m, d };
}

/**
 * The day a study taken on `performedOn` is due again, `months` later. A day the later month lacks
 * (31 January + 1 month) falls back to that month's last day, as a calendar reminder would.
 */
export function studyDueOn(performedOn: string, months: number): string {
  const { y, m, d } = parseDay(performedOn, "The study's date");
  if (!Number.isInteger(months) || months < 1) {
    throw new Error(`A study stays current a whole number of months, 1 or more; got ${String(months)}`);
  }
  const monthIndex = m - 1 + months;
  const lastDay = new Date(Date.UTC(y, monthIndex + 1, 0)).getUTCDate();
  return new Date(Date.UTC(y, monthIndex, Math.min(d, lastDay))).toISOString().slice(0, 10);
}

export type StudyStatus = "none" | "current" | "due";

/**
 * Whether a gauge's latest study still stands on `today` (YYYY-MM-DD, or a Date read in UTC). Like a
 * calibration, a study is good through its due date and due the day after.
 */
export function studyStatus(summary: GaugeStudySummary | undefined | null, today: string | Date): StudyStatus {
  if (!summary) return "none";
  const day = today instanceof Date ? today.toISOString().slice(0, 10) : today;
  parseDay(day, "Today");
  parseDay(summary.dueOn, "The study's due date");
  return day > summary.dueOn ? "due" : "current";
}
