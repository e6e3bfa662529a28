// Taper and out-of-round from two-point diameter readings, as engine service manuals use them:
// readings by depth (bore) or position along the journal, on two axes 90° apart.
// Taper = max − min along one axis, worst axis reported; out-of-round = |A − B| at the same
// depth, worst depth reported. (Taking max − min of all readings would be a different
// quantity, so it is deliberately not what `taper` means here.)
import { decimalDifference, decimalSum } from "./units";

export interface AxisReadings {
  /** Diameters on the first axis (e.g. thrust), top / front first. */
  axisA: number[];
  /** Diameters on the second axis, 90° from the first, same depths in the same order. */
  axisB: number[];
}

export interface GeometryResult {
  taperA: number;
  taperB: number;
  /** Worst of taperA and taperB. */
  taper: number;
  /** |A − B| at each depth, in reading order. */
  outOfRoundByDepth: number[];
  /** Worst out-of-round over all depths. */
  outOfRound: number;
  max: number;
  min: number;
  mean: number;
}

function validate(input: AxisReadings, what: string): void {
  if (input === null || typeof input !== "object") {
    throw new Error(`${what} geometry needs { axisA: number[], axisB: number[] }`);
  }
  const { axisA, axisB } = input;
  if (!Array.isArray(axisA) || !Array.isArray(axisB)) {
    throw new Error(`${what} geometry needs axisA and axisB as lists of diameters`);
  }
  if (axisA.length === 0 || axisB.length === 0) {
    throw new Error(`${what} geometry needs at least one reading on each axis`);
  }
  if (axisA.length !== axisB.length) {
    throw new Error(
      `${what} geometry needs the same number of readings on both axes; ` +
        `axis A has ${axisA.length}, axis B has ${axisB.length}`,
    );
  }
  for (const [name, axis] of [
    ["A", axisA],
    ["B", axisB],
  ] as const) {
    axis.forEach((value, i) => {
      if (typeof value !== "number" || !Number.isFinite(value)) {
        throw new Error(`${what} reading ${i + 1} on axis ${name} is not a number; re-enter it`);
      }
    });
  }
}

function spread(values: number[]): number {
  return decimalDifference(Math.max(...values), Math.min(...values));
}

function geometry(input: AxisReadings, what: string): GeometryResult {
  validate(input, what);
  const { axisA, axisB } = input;
  const taperA = spread(axisA);
  const taperB = spread(axisB);
  const outOfRoundByDepth = axisA.map((a, i) => Math.abs(decimalDifference(a, axisB[i])));
  const all = [...axisA, ...axisB];
  return {
    taperA,
    taperB,
    taper: Math.max(taperA, taperB),
    outOfRoundByDepth,
    outOfRound: Math.max(...outOfRoundByDepth),
    max: Math.max(...all),
    min: Math.min(...all),
    mean: decimalSum(all) / all.length,
  };
}

/** Cylinder bore: readings top, middle, bottom (any count ≥ 1) on thrust and pin axes. */
export function boreGeometry(input: AxisReadings): GeometryResult {
  return geometry(input, "Bore");
}

/** Crank, rod or cam journal: readings by position along the journal on two axes 90° apart. */
export function journalGeometry(input: AxisReadings): GeometryResult {
  return geometry(input, "Journal");
}
