// The fast paths of verdict.ts: each answers exactly as verdict.ts's decimal path would, or gives
// up (undefined / NaN) and lets that path answer, with its errors for bad input. They never throw.
import type { Verdict } from "./enums";
import { divideHalfUp, isFiniteNumber, placesFor, placesForAll, POW10, scaledFigure } from "./scaled-figures";

/** A figure that may be left out (null or undefined); anything else must be a finite number. */
function given(x: unknown): number | undefined | null {
  if (x === null || x === undefined) return undefined;
  return isFiniteNumber(x) ? x : null; // null: not a finite number, the decimal path says why
}

/** U, 0 when not given (as the decimal path takes it), null when not a finite number. */
function givenUncertainty(x: unknown): number | null {
  return given(x) ?? (x === undefined || x === null ? 0 : null);
}

/** 1 when a − b is decided positive, −1 negative, 0 when too close to call with doubles. */
function side(difference: number, tolerance: number): -1 | 0 | 1 {
  return difference > tolerance ? 1 : difference < -tolerance ? -1 : 0;
}

/**
 * The verdict with plain doubles, when every comparison it makes is decided by a margin of
 * 1e-9 of the figures' total size. A figure differs from its 12-digit decimal by at most 5e-12 of
 * its size and a double sum or difference is off by about 1e-16 of its operands, so a difference
 * beyond that margin has the sign of the exact decimals' difference (which is then not 0 either).
 * Near a limit (on it, on limit ± U, float noise) it gives up. Sizes are kept well inside the
 * doubles' range, so nothing overflows and no subnormal loses its relative precision.
 */
export function quickVerdict(value: unknown, min: unknown, max: unknown, uncertainty: unknown): Verdict | undefined {
  const lo = given(min);
  const hi = given(max);
  const u = givenUncertainty(uncertainty);
  if (!isFiniteNumber(value) || lo === null || hi === null || u === null || u < 0) return undefined;
  if (lo === undefined && hi === undefined) return undefined;
  const size = Math.abs(value) + Math.abs(lo ?? 0) + Math.abs(hi ?? 0) + u;
  if (!(size > 1e-290 && size < 1e290)) return undefined;
  const tolerance = 1e-9 * size;
  if (lo !== undefined && hi !== undefined && side(hi - lo, tolerance) !== 1) return undefined;
  // The decimal path's order: beyond a limit is out_of_spec, then within U of one is marginal.
  const checks: [number | undefined, number, -1 | 1, Verdict][] = [
    [lo, 0, -1, "out_of_spec"],
    [hi, 0, 1, "out_of_spec"],
    [lo, u, -1, "marginal"],
    [hi, -u, 1, "marginal"],
  ];
  for (const [limit, shift, beyond, outcome] of checks) {
    if (limit === undefined) continue;
    const s = side(value - (limit + shift), tolerance);
    if (s === 0) return undefined;
    if (s === beyond) return outcome;
  }
  return "in_spec";
}

/** The conformance zone from scaled integers (exact: see scaled-figures.ts), or undefined. */
export function quickZone(
  min: unknown,
  max: unknown,
  uncertainty: unknown,
): { min?: number; max?: number; empty: boolean } | undefined {
  const lo = given(min);
  const hi = given(max);
  const u = givenUncertainty(uncertainty);
  if (lo === null || hi === null || u === null || u < 0 || (lo === undefined && hi === undefined)) return undefined;
  const k = placesForAll(lo ?? 0, hi ?? 0, u);
  if (k < 0) return undefined;
  const rLo = lo === undefined ? 0 : scaledFigure(lo, k);
  const rHi = hi === undefined ? 0 : scaledFigure(hi, k);
  const rU = scaledFigure(u, k);
  if (Number.isNaN(rLo + rHi + rU)) return undefined;
  if (lo !== undefined && hi !== undefined && rLo > rHi) return undefined; // the decimal path explains it
  return {
    ...(lo !== undefined ? { min: (rLo + rU) / POW10[k] } : {}),
    ...(hi !== undefined ? { max: (rHi - rU) / POW10[k] } : {}),
    empty: lo !== undefined && hi !== undefined && rLo + rU > rHi - rU,
  };
}

/**
 * Value minus nominal (or minus the middle of min and max) from scaled integers; undefined for a
 * one-sided limit without nominal, as the decimal path answers; NaN to hand over to that path.
 * The middle is exact as (rMin + rMax) / 2, so the difference is (2·rValue − rMin − rMax) / (2·10^k).
 */
export function quickDeviation(
  value: number,
  limit: { min?: number | null; max?: number | null; nominal?: number | null },
): number | undefined {
  if (!isFiniteNumber(value)) return NaN;
  const nominal = given(limit.nominal);
  if (nominal === null) return NaN;
  if (nominal !== undefined) {
    const k = placesForAll(value, nominal);
    return k < 0 ? NaN : (scaledFigure(value, k) - scaledFigure(nominal, k)) / POW10[k];
  }
  if (limit.min === undefined || limit.max === undefined || limit.min === null || limit.max === null) return undefined;
  return pairMiddle(value, limit.min, limit.max);
}

function pairMiddle(value: number, lo: unknown, hi: unknown): number {
  if (!isFiniteNumber(lo) || !isFiniteNumber(hi)) return NaN;
  const k = placesForAll(value, lo, hi);
  if (k < 0) return NaN;
  return (2 * scaledFigure(value, k) - scaledFigure(lo, k) - scaledFigure(hi, k)) / (2 * POW10[k]);
}

/**
 * The deviation in tenths of display steps of 10^-places, rounded a half away from zero as the
 * decimal path rounds steps to one decimal: the figure's scaled integer divided by 10^(k−places−1).
 * NaN to hand over to the decimal path.
 */
export function quickStepTenths(dev: number, places: number): number {
  if (!isFiniteNumber(dev)) return NaN;
  const k = placesFor(Math.abs(dev));
  if (k < places + 1) return NaN;
  const r = scaledFigure(dev, k);
  if (Number.isNaN(r)) return NaN;
  const tenths = divideHalfUp(Math.abs(r), POW10[k - places - 1]);
  return r < 0 && tenths !== 0 ? -tenths : tenths;
}
