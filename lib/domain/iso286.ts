// ISO 286 limits and fits for the classes a machine shop meets on bearing housings, pins,
// bushings and dowels: holes H, shafts f g h js k m n p, grades IT5–IT9, sizes 3–500 mm.
// Deviations are integers in µm and limits are formed in µm before dividing, so 50 + 0.025
// cannot pick up float noise.
import { cleanDecimal } from "./units";

/**
 * Upper ends of the ISO 286-1:2010 nominal size ranges ("over … up to and including").
 * The first row is "up to and including 3", so 3 mm itself belongs to it.
 * Source: ISO 286-1:2010 Table 1 (range rows; same rows in Table 2/3 for these letters).
 */
const RANGE_UPPER_MM = [3, 6, 10, 18, 30, 50, 80, 120, 180, 250, 315, 400, 500] as const;

/** Smallest nominal size this module accepts (the scope starts at 3 mm). */
export const ISO286_MIN_MM = 3;
/** Largest nominal size this module accepts. */
export const ISO286_MAX_MM = 500;

/**
 * Standard tolerance grades, µm, one value per range above.
 * Source: ISO 286-1:2010 Table 1 "Values of standard tolerance grades"; written from memory
 * and cross-read against several independent reproductions of the same table.
 */
const IT_UM: Readonly<Record<number, readonly number[]>> = {
  5: [4, 5, 6, 8, 9, 11, 13, 15, 18, 20, 23, 25, 27],
  6: [6, 8, 9, 11, 13, 16, 19, 22, 25, 29, 32, 36, 40],
  7: [10, 12, 15, 18, 21, 25, 30, 35, 40, 46, 52, 57, 63],
  8: [14, 18, 22, 27, 33, 39, 46, 54, 63, 72, 81, 89, 97],
  9: [25, 30, 36, 43, 52, 62, 74, 87, 100, 115, 130, 140, 155],
};

/**
 * Shaft fundamental deviations, µm. For f, g, h it is the upper deviation es; for k, m, n, p
 * the lower deviation ei. Source: ISO 286-1:2010 Table 2 (a–h, es) and Table 3 (k–p, ei),
 * from memory, cross-read against reproductions. The k row applies to grades 4–7 only; for
 * grades 8 and up ISO 286-1 Table 3 gives ei = 0 (handled in shaftDeviations).
 */
const SHAFT_ES_UM: Readonly<Record<string, readonly number[]>> = {
  f: [-6, -10, -13, -16, -20, -25, -30, -36, -43, -50, -56, -62, -68],
  g: [-2, -4, -5, -6, -7, -9, -10, -12, -14, -15, -17, -18, -20],
  h: [0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0],
};
const SHAFT_EI_UM: Readonly<Record<string, readonly number[]>> = {
  k: [0, 1, 1, 1, 2, 2, 2, 3, 3, 4, 4, 4, 5],
  m: [2, 4, 6, 7, 8, 9, 11, 13, 15, 17, 20, 21, 23],
  n: [4, 8, 10, 12, 15, 17, 20, 23, 27, 31, 34, 37, 40],
  p: [6, 12, 15, 18, 22, 26, 32, 37, 43, 50, 56, 62, 68],
};

export type Iso286Grade = 5 | 6 | 7 | 8 | 9;
export type Iso286Letter = "H" | "f" | "g" | "h" | "js" | "k" | "m" | "n" | "p";
/** Upper and lower limit deviations in µm (ES/EI for a hole, es/ei for a shaft). */
export interface Iso286Deviations {
  upper: number;
  lower: number;
}

const SUPPORTED = "holes H; shafts f, g, h, js, k, m, n, p; grades 5–9 (e.g. 'H7', 'g6', 'js6')";

function rangeIndex(nominalMm: number): number {
  if (typeof nominalMm !== "number" || !Number.isFinite(nominalMm)) {
    throw new Error(`ISO 286 nominal size must be a number of millimetres; got ${String(nominalMm)}`);
  }
  if (nominalMm < ISO286_MIN_MM || nominalMm > ISO286_MAX_MM) {
    throw new Error(
      `ISO 286 nominal size ${nominalMm} mm is outside the supported ${ISO286_MIN_MM}–${ISO286_MAX_MM} mm; ` +
        "enter the basic size in millimetres",
    );
  }
  // "over … up to and including": a size exactly on a boundary belongs to the lower range.
  return RANGE_UPPER_MM.findIndex((upper) => nominalMm <= upper);
}

function parseGrade(grade: number | string): Iso286Grade {
  const n = typeof grade === "string" ? Number(grade.trim().replace(/^IT/i, "")) : grade;
  if (!Number.isInteger(n) || n < 5 || n > 9) {
    throw new Error(`Unknown IT grade '${String(grade)}'; use 5–9 (IT5–IT9)`);
  }
  return n as Iso286Grade;
}

/** Standard tolerance ITn in µm for a nominal size in mm. Accepts 7 or 'IT7'. */
export function itGrade(nominalMm: number, grade: number | string): number {
  const g = parseGrade(grade);
  const row = IT_UM[g];
  return row[rangeIndex(nominalMm)];
}

function parseClass(cls: string): { letter: Iso286Letter; grade: Iso286Grade } {
  const match = typeof cls === "string" ? /^\s*(H|f|g|h|js|k|m|n|p)(\d{1,2})\s*$/.exec(cls) : null;
  if (!match) {
    throw new Error(`Unknown ISO 286 tolerance class '${String(cls)}'; supported: ${SUPPORTED}`);
  }
  const grade = Number(match[2]);
  if (grade < 5 || grade > 9) {
    throw new Error(`ISO 286 class '${cls}' has grade ${grade}; supported: ${SUPPORTED}`);
  }
  return { letter: match[1] as Iso286Letter, grade: grade as Iso286Grade };
}

function jsHalfWidth(it: number, grade: Iso286Grade): number {
  // ISO 286-1:2010, 5.3 note / ISO 286-2 tables: for js7–js11 an odd ITn is rounded down to the
  // even value below, so the deviations are whole µm (js7 at 18–30 mm is ±10, not ±10.5).
  // Grades 5 and 6 keep the exact half (js6 at 18–30 mm is ±6.5). From memory.
  return grade >= 7 && it % 2 === 1 ? (it - 1) / 2 : it / 2;
}

function shaftDeviations(letter: Iso286Letter, grade: Iso286Grade, idx: number, it: number): Iso286Deviations {
  if (letter === "js") {
    const half = jsHalfWidth(it, grade);
    return { upper: half, lower: -half };
  }
  const es = SHAFT_ES_UM[letter];
  if (es) return { upper: es[idx], lower: es[idx] - it };
  const eiRow = SHAFT_EI_UM[letter];
  const ei = letter === "k" && grade > 7 ? 0 : eiRow[idx];
  return { upper: ei + it, lower: ei };
}

/** Limit deviations in µm for a class at a nominal size (e.g. 50, 'g6' → { upper: −9, lower: −25 }). */
export function iso286Deviations(nominalMm: number, cls: string): Iso286Deviations {
  const { letter, grade } = parseClass(cls);
  const idx = rangeIndex(nominalMm);
  const it = IT_UM[grade][idx];
  if (letter === "H") return { upper: it, lower: 0 }; // basic hole: EI = 0
  return shaftDeviations(letter, grade, idx, it);
}

function addMicrometres(nominalMm: number, deviationUm: number): number {
  return cleanDecimal((nominalMm * 1000 + deviationUm) / 1000);
}

/** Smallest and largest permitted size in mm for a tolerance class (e.g. 50, 'H7' → 50.000 … 50.025). */
export function iso286Limits(nominalMm: number, cls: string): { min: number; max: number } {
  const dev = iso286Deviations(nominalMm, cls);
  return { min: addMicrometres(nominalMm, dev.lower), max: addMicrometres(nominalMm, dev.upper) };
}

/**
 * Clearance range of a hole/shaft fit in mm. Negative values are interference
 * (e.g. 50 H7/p6 gives minClearance −0.042).
 */
export function iso286Fit(
  nominalMm: number,
  holeClass: string,
  shaftClass: string,
): { minClearance: number; maxClearance: number } {
  if (!/^\s*H/.test(holeClass) || /^\s*H/.test(shaftClass)) {
    throw new Error(`A fit needs a hole class (H…) then a shaft class (f…p); got '${holeClass}' / '${shaftClass}'`);
  }
  const hole = iso286Deviations(nominalMm, holeClass);
  const shaft = iso286Deviations(nominalMm, shaftClass);
  return {
    minClearance: cleanDecimal((hole.lower - shaft.upper) / 1000),
    maxClearance: cleanDecimal((hole.upper - shaft.lower) / 1000),
  };
}
