// Unit conversions for the measurement core. Every factor is an exact definition
// (NIST SP 811, Appendix B: 1 in = 25.4 mm, 1 ft = 0.3048 m, 1 lb = 0.45359237 kg,
// standard gravity g = 9.80665 m/s²), so nothing here is a rounded "shop" factor.
import Decimal from "decimal.js-light";
// The unit names live once, in enums.ts.
import { LENGTH_UNITS, TORQUE_UNITS, type LengthUnit, type MeasureUnit, type TorqueUnit } from "./enums";
import { divideHalfUp, placesFor, placesForAll, POW10, scaledFigure } from "./scaled-figures";
import type { QuantityKind } from "./types";

/** Millimetres in one inch (exact, international inch of 1959). */
export const MM_PER_IN = 25.4;
/** Metres in one foot (exact). */
export const M_PER_FT = 0.3048;
/** Kilograms in one avoirdupois pound (exact). */
export const KG_PER_LB = 0.45359237;
/** Standard acceleration of gravity, m/s² (exact, CGPM 1901). */
export const STANDARD_GRAVITY = 9.80665;
/** Newtons in one pound-force: lb × g (exact product 4.4482216152605). */
export const N_PER_LBF = KG_PER_LB * STANDARD_GRAVITY;
/** Cubic centimetres in one cubic inch: 2.54³ = 16.387064 (exact). */
export const CC_PER_CUBIC_IN = 16.387064;
/** Newton-metres in one pound-force foot. */
export const NM_PER_LBF_FT = N_PER_LBF * M_PER_FT;
/** Kilopascals in one psi: lbf / in² = 4.4482216152605 N / 0.00064516 m². */
export const KPA_PER_PSI = N_PER_LBF / (0.0254 * 0.0254) / 1000;

function requireFinite(value: number, name: string): void {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new Error(`${name} must be a finite number; got ${String(value)}`);
  }
}

/**
 * Rounds a result to 12 significant digits: far finer than any gauge (0.0001 in, 0.001 mm),
 * far coarser than float error. It cleans results whose size is like their operands' (a
 * product such as 0.3353 × 1.73, a unit conversion). It cannot clean a small difference of
 * large readings (4.0302 − 4.0301 = 0.0000999999999998 keeps its noise at 12 digits), so
 * differences of readings go through decimalDifference / decimalSum instead.
 */
export function cleanDecimal(x: number): number {
  if (!Number.isFinite(x)) return x;
  // Fast and the same: a short decimal's scaled integer over 10^k (scaled-figures.ts says why).
  const k = placesFor(Math.abs(x));
  const r = k < 0 ? NaN : scaledFigure(x, k);
  if (!Number.isNaN(r)) return r / POW10[k];
  const rounded = Number(x.toPrecision(12));
  return rounded === 0 ? 0 : rounded; // never hand back -0
}

/**
 * The step each unit's figures are shown and exported to (common practice): inch work to the
 * tenth (0.0001 in), metric work to the micrometre (0.001 mm), torque to the whole unit.
 */
export const DISPLAY_RESOLUTION: Readonly<Record<MeasureUnit, string>> = {
  in: "0.0001",
  mm: "0.001",
  lbf_ft: "1",
  nm: "1",
};

// Each unit's decimal places at its display resolution, counted once (an export rounds hundreds).
const DISPLAY_PLACES: Partial<Record<string, number>> = Object.fromEntries(
  Object.entries(DISPLAY_RESOLUTION).map(([u, step]) => [u, step.includes(".") ? step.split(".")[1].length : 0]),
);

/**
 * A figure rounded to its unit's display resolution by plain decimal rounding (to the nearest
 * step, a half away from zero), on the figure as written after cleanDecimal: a limit computed as
 * 0.00045 × 4.0817 = 0.001836765 in is shown 0.0018 in.
 */
export function roundToResolution(x: number, unit: MeasureUnit): number {
  const places = DISPLAY_PLACES[unit];
  if (places === undefined)
    throw new Error(`Unknown unit '${String(unit)}'; use ${Object.keys(DISPLAY_RESOLUTION).join(", ")}`);
  const quick = quickRound(x, places);
  if (!Number.isNaN(quick)) return quick;
  const rounded = toDecimal(x, "Figure").toDecimalPlaces(places, Decimal.ROUND_HALF_UP).toNumber();
  return rounded === 0 ? 0 : rounded;
}

/**
 * roundToResolution by integers, or NaN for the decimal path: the figure's scaled integer r (12
 * significant digits, as cleanDecimal takes it) divided by 10^(k − places), a half away from zero.
 */
function quickRound(x: number, places: number): number {
  if (!Number.isFinite(x)) return NaN;
  const k = placesFor(Math.abs(x));
  if (k < places) return NaN;
  const r = scaledFigure(x, k);
  if (Number.isNaN(r)) return NaN;
  const steps = divideHalfUp(Math.abs(r), POW10[k - places]);
  return steps === 0 ? 0 : (r < 0 ? -steps : steps) / POW10[places];
}

function toDecimal(x: number, name: string): Decimal {
  requireFinite(x, name);
  // Operands are first cleaned to 12 significant digits so a reading that went through a unit
  // conversion (4.0302 × 25.4 = 102.36708000000001) is taken as the decimal figure it stands for.
  return new Decimal(cleanDecimal(x));
}

/**
 * a − b done on the decimal figures as written, so 4.0312 − 4.0302 is exactly 0.001 and a value
 * that sits on a limit stays on it (the "numbers must be right at the limit").
 */
export function decimalDifference(a: number, b: number): number {
  if (Number.isFinite(a) && Number.isFinite(b)) {
    const k = placesForAll(a, b);
    const difference = k < 0 ? NaN : (scaledFigure(a, k) - scaledFigure(b, k)) / POW10[k];
    if (!Number.isNaN(difference)) return difference;
  }
  return toDecimal(a, "first value").minus(toDecimal(b, "second value")).toNumber();
}

/** Exact sum of signed decimal figures (stack-ups such as deck − stroke/2 − rod − clearance). */
export function decimalSum(terms: readonly number[]): number {
  // Below 9,000 terms of under 1e12 the integer sum stays exact (< 2^53), as Decimal's does at 20 digits.
  if (terms.length < 9000 && terms.every(Number.isFinite)) {
    const k = placesForAll(...terms);
    let sum = 0;
    for (const t of terms) sum += k < 0 ? NaN : scaledFigure(t, k);
    if (!Number.isNaN(sum)) return sum / POW10[k];
  }
  return terms.reduce((sum: Decimal, t, i) => sum.plus(toDecimal(t, `term ${i + 1}`)), new Decimal(0)).toNumber();
}

export function inToMm(inches: number): number {
  requireFinite(inches, "inches");
  return inches * MM_PER_IN;
}

export function mmToIn(mm: number): number {
  requireFinite(mm, "millimetres");
  return mm / MM_PER_IN;
}

export function cubicInToCc(cubicIn: number): number {
  requireFinite(cubicIn, "cubic inches");
  return cubicIn * CC_PER_CUBIC_IN;
}

export function ccToCubicIn(cc: number): number {
  requireFinite(cc, "cubic centimetres");
  return cc / CC_PER_CUBIC_IN;
}

export function lbfFtToNm(lbfFt: number): number {
  requireFinite(lbfFt, "torque in lbf·ft");
  return lbfFt * NM_PER_LBF_FT;
}

export function nmToLbfFt(nm: number): number {
  requireFinite(nm, "torque in N·m");
  return nm / NM_PER_LBF_FT;
}

export function psiToKpa(psi: number): number {
  requireFinite(psi, "pressure in psi");
  return psi * KPA_PER_PSI;
}

export function kpaToPsi(kpa: number): number {
  requireFinite(kpa, "pressure in kPa");
  return kpa / KPA_PER_PSI;
}

export function fToC(fahrenheit: number): number {
  requireFinite(fahrenheit, "temperature in °F");
  return ((fahrenheit - 32) * 5) / 9;
}

export function cToF(celsius: number): number {
  requireFinite(celsius, "temperature in °C");
  return (celsius * 9) / 5 + 32;
}

export function convertLength(value: number, from: LengthUnit, to: LengthUnit): number {
  requireUnit(from, LENGTH_UNITS, "length unit");
  requireUnit(to, LENGTH_UNITS, "length unit");
  if (from === to) {
    requireFinite(value, "length");
    return value;
  }
  return from === "in" ? inToMm(value) : mmToIn(value);
}

export function convertTorque(value: number, from: TorqueUnit, to: TorqueUnit): number {
  requireUnit(from, TORQUE_UNITS, "torque unit");
  requireUnit(to, TORQUE_UNITS, "torque unit");
  if (from === to) {
    requireFinite(value, "torque");
    return value;
  }
  return from === "lbf_ft" ? lbfFtToNm(value) : nmToLbfFt(value);
}

function requireUnit(unit: string, allowed: readonly string[], name: string): void {
  if (!allowed.includes(unit)) {
    throw new Error(`Unknown ${name} '${String(unit)}'; use one of ${allowed.join(", ")}`);
  }
}

/** The quantity a unit measures, or undefined for a unit the core does not know. */
export function quantityOfUnit(unit: string): QuantityKind | undefined {
  return (LENGTH_UNITS as readonly string[]).includes(unit)
    ? "length"
    : (TORQUE_UNITS as readonly string[]).includes(unit)
      ? "torque"
      : undefined;
}

/** `value` in `from` expressed in `to`; undefined when one is a length and the other a torque (or unknown). */
export function convertMeasure(value: number, from: string, to: string): number | undefined {
  if (from === to) return value;
  const kind = quantityOfUnit(from);
  if (!kind || kind !== quantityOfUnit(to)) return undefined;
  return kind === "length"
    ? convertLength(value, from as LengthUnit, to as LengthUnit)
    : convertTorque(value, from as TorqueUnit, to as TorqueUnit);
}
