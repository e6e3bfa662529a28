// What a study's input must be before its statistics mean anything, in words that say what to fix.
import type { GrrMeasurement, StudyCharacteristic, StudyReference } from "./types";

export const TYPE1_READINGS = { min: 25, max: 50 } as const;
export const GRR_DESIGN = {
  appraisers: { min: 2, max: 3 },
  parts: { min: 5, max: 10 },
  trials: { min: 2, max: 3 },
} as const;

function isFiniteNumber(x: unknown): x is number {
  return typeof x === "number" && Number.isFinite(x);
}

/** Problems with a repeatability study's readings (empty when they will do). */
export function checkType1Readings(readings: readonly unknown[]): string[] {
  const problems: string[] = [];
  readings.forEach((r, i) => {
    if (!isFiniteNumber(r)) problems.push(`Reading ${i + 1} is not a number: take it again.`);
  });
  const n = readings.length;
  if (n < TYPE1_READINGS.min) {
    const more = TYPE1_READINGS.min - n;
    problems.push(
      `A repeatability study needs ${TYPE1_READINGS.min} to ${TYPE1_READINGS.max} readings; ` +
        `${n} so far: take ${more} more.`,
    );
  } else if (n > TYPE1_READINGS.max) {
    problems.push(
      `A repeatability study takes at most ${TYPE1_READINGS.max} readings; ` +
        `${n} were given: leave out the last ${n - TYPE1_READINGS.max}.`,
    );
  }
  return problems;
}

/** Problems with the reference, the gauge's step and the tolerances a study is judged against. */
export function checkStudyFigures(
  reference: StudyReference,
  resolution: number,
  characteristics: readonly StudyCharacteristic[],
): string[] {
  const problems: string[] = [];
  if (!isFiniteNumber(reference.value))
    problems.push("The reference's size is not a number: copy it from its certificate.");
  if (!isFiniteNumber(reference.expandedU) || reference.expandedU < 0) {
    problems.push("The reference's uncertainty U must be zero or more: copy it from its certificate.");
  }
  if (!isFiniteNumber(reference.coverageK) || reference.coverageK <= 0) {
    problems.push("The reference's coverage factor k must be above zero (a certificate's is usually 2).");
  }
  if (!isFiniteNumber(resolution) || resolution <= 0) {
    problems.push("The gauge's resolution (its smallest step) must be above zero: set it on the gauge's page.");
  }
  for (const c of characteristics) {
    if (!isFiniteNumber(c.tolerance) || c.tolerance <= 0) {
      problems.push(
        `The tolerance of ${c.characteristic || "a characteristic"} must be above zero (upper − lower limit).`,
      );
    }
  }
  return problems;
}

function countWords(what: string, n: number, range: { min: number; max: number }): string | undefined {
  if (n >= range.min && n <= range.max) return undefined;
  return `An R&R study takes ${range.min} to ${range.max} ${what}; ${n} were given.`;
}

function numberingProblem(m: GrrMeasurement, i: number): string | undefined {
  const fields = [m.appraiser, m.part, m.trial];
  if (fields.every((x) => Number.isInteger(x) && x >= 1)) return undefined;
  return `Measurement ${i + 1} must name its appraiser, part and trial by whole numbers from 1.`;
}

function cellName(a: number, p: number): string {
  return `Appraiser ${a}, part ${p}`;
}

/**
 * Problems with an R&R study's design (empty when it will do): 2–3 appraisers, 5–10 parts and
 * 2–3 trials, balanced (every appraiser measured every part every trial, once), finite figures.
 */
export function checkGrrDesign(measurements: readonly GrrMeasurement[]): string[] {
  const problems: string[] = [];
  measurements.forEach((m, i) => {
    const numbering = numberingProblem(m, i);
    if (numbering) problems.push(numbering);
    else if (!isFiniteNumber(m.value)) {
      problems.push(`${cellName(m.appraiser, m.part)}, trial ${m.trial} is not a number: measure it again.`);
    }
  });
  if (problems.length > 0) return problems;
  const distinct = (key: keyof GrrMeasurement) => [...new Set(measurements.map((m) => m[key]))].sort((x, y) => x - y);
  const appraisers = distinct("appraiser");
  const parts = distinct("part");
  const trials = distinct("trial");
  for (const p of [
    countWords("appraisers", appraisers.length, GRR_DESIGN.appraisers),
    countWords("parts", parts.length, GRR_DESIGN.parts),
    countWords("trials", trials.length, GRR_DESIGN.trials),
  ]) {
    if (p) problems.push(p);
  }
  const seen = new Map<string, number>();
  for (const m of measurements) {
    const key = `${m.appraiser}/${m.part}/${m.trial}`;
    seen.set(key, (seen.get(key) ?? 0) + 1);
  }
  for (const a of appraisers) {
    for (const p of parts) {
      const missing = trials.filter((t) => !seen.has(`${a}/${p}/${t}`));
      const twice = trials.filter((t) => (seen.get(`${a}/${p}/${t}`) ?? 0) > 1);
      if (missing.length > 0) problems.push(`${cellName(a, p)} lacks trial ${missing.join(" and ")}: measure it.`);
      if (twice.length > 0) {
        problems.push(`${cellName(a, p)} has trial ${twice.join(" and ")} more than once: keep one of each.`);
      }
    }
  }
  return problems;
}
