// The repeatability ("type 1") study: one gauge, one reference, 25 to 50 readings. Its spread and
// bias against the tolerance T of each characteristic the gauge judges, as Cg = 0.2·T/(6·s) and
// Cgk = (0.1·T − |bias|)/(3·s) (common practice: 20 % of T for the gauge's 6·s spread).
import jStat from "jstat";
import { checkStudyFigures, checkType1Readings } from "./checks";
import type { CharacteristicCapability, StudyThresholds, Type1Input, Type1Result } from "./types";
import { indexFigure, measureFigure, percentFigure } from "./words";

/** Relative slack for comparing a computed figure with a pass mark, so float noise never flips one. */
const MARK_SLACK = 1e-9;

/** Mean and sample standard deviation (n − 1), taken about the first reading so equal readings stay exact. */
export function meanAndSd(values: readonly number[]): { mean: number; sd: number } {
  const origin = values[0];
  const n = values.length;
  const shift = values.reduce((sum, x) => sum + (x - origin), 0) / n;
  const squares = values.reduce((sum, x) => sum + (x - origin - shift) ** 2, 0);
  return { mean: origin + shift, sd: n > 1 ? Math.sqrt(squares / (n - 1)) : 0 };
}

function atLeast(value: number, mark: number): boolean {
  return value >= mark - MARK_SLACK * Math.abs(mark);
}

/**
 * Whether a gauge of spread `sd` and `bias` is capable for one tolerance T: Cg, Cgk and its step δ
 * as a percentage of T against the shop's marks. With no spread at all (every reading the same) the
 * indices are not worked out (null): the study could not see the gauge's spread through its step.
 */
export function capabilityFor(
  gauge: { sd: number; bias: number },
  resolution: number,
  tolerance: number,
  thresholds: StudyThresholds,
  characteristic = "",
): CharacteristicCapability {
  if (!(tolerance > 0) || !Number.isFinite(tolerance)) {
    throw new Error(`The tolerance T must be above zero; got ${String(tolerance)}`);
  }
  if (!(gauge.sd >= 0) || !Number.isFinite(gauge.sd) || !Number.isFinite(gauge.bias)) {
    throw new Error("The gauge's spread must be zero or more and its bias a number");
  }
  const resolutionPct = (100 * resolution) / tolerance;
  const resolutionOk = 100 * resolution <= thresholds.maxResolutionPct * tolerance * (1 + MARK_SLACK);
  const reasons: string[] = [];
  let cg: number | null = null;
  let cgk: number | null = null;
  if (gauge.sd > 0) {
    cg = (0.2 * tolerance) / (6 * gauge.sd);
    cgk = (0.1 * tolerance - Math.abs(gauge.bias)) / (3 * gauge.sd);
    if (!atLeast(cg, thresholds.minCg)) {
      reasons.push(
        `Cg ${indexFigure(cg)} is below ${indexFigure(thresholds.minCg)}: the gauge's spread ` +
          `(s = ${measureFigure(gauge.sd)}) is too wide for a tolerance of ${measureFigure(tolerance)}.`,
      );
    }
    if (!atLeast(cgk, thresholds.minCgk)) {
      reasons.push(
        `Cgk ${indexFigure(cgk)} is below ${indexFigure(thresholds.minCgk)}: its spread with its bias ` +
          `(${measureFigure(gauge.bias)}) takes too much of a tolerance of ${measureFigure(tolerance)}.`,
      );
    }
  } else {
    reasons.push(
      "Every reading was the same, so the study shows no spread to judge Cg and Cgk by: " +
        "repeat it with a gauge that reads in finer steps.",
    );
  }
  if (!resolutionOk) {
    reasons.push(
      `The gauge's step ${measureFigure(resolution)} is ${percentFigure(resolutionPct)} of the tolerance; ` +
        `at most ${percentFigure(thresholds.maxResolutionPct)} will do.`,
    );
  }
  return { characteristic, tolerance, cg, cgk, resolutionPct, resolutionOk, pass: reasons.length === 0, reasons };
}

/** Two-sided p-value of Student's t with `df` degrees of freedom. */
function twoSidedP(t: number, df: number): number {
  return Math.min(1, 2 * jStat.studentt.cdf(-Math.abs(t), df));
}

/** The repeatability study's figures and its verdict per characteristic. Throws the input's problems in words. */
export function type1Study(input: Type1Input): Type1Result {
  const problems = [
    ...checkType1Readings(input.readings),
    ...checkStudyFigures(input.reference, input.resolution, input.characteristics),
  ];
  if (problems.length > 0) throw new Error(problems.join(" "));
  const n = input.readings.length;
  const { mean, sd } = meanAndSd(input.readings);
  const bias = mean - input.reference.value;
  const notes: string[] = [];
  let t: number | null = null;
  let pValue: number | null = null;
  let biasSignificant: boolean;
  if (sd > 0) {
    t = bias / (sd / Math.sqrt(n));
    pValue = twoSidedP(t, n - 1);
    biasSignificant = pValue < 0.05;
  } else {
    biasSignificant = bias !== 0;
    notes.push(`Every reading was ${measureFigure(mean)}: the study shows no spread through the gauge's step.`);
  }
  if (biasSignificant) {
    notes.push(
      `The gauge reads ${measureFigure(bias)} off the reference, more than its spread explains ` +
        "(t-test, 5 %): check its zero against the setting master.",
    );
  }
  const perCharacteristic = input.characteristics.map((c) =>
    capabilityFor({ sd, bias }, input.resolution, c.tolerance, input.thresholds, c.characteristic),
  );
  return { n, mean, sd, bias, t, pValue, biasSignificant, notes, perCharacteristic };
}
