// The decimal maths as it was before the fast paths (lib/domain/verdict.ts, December 2026), kept verbatim
// (imports pointed back at lib/domain) as the reference decimal-before.test.ts compares the new code with.
// Conformity verdicts with a guard band, after ISO 14253-1:2017 (decision rules for proving
// conformity or non-conformity with specifications): the conformance zone is the
// specification zone shrunk by the expanded uncertainty U on each side.
//   inside the conformance zone (edges included)        → in_spec
//   inside the specification zone but within U of a limit → marginal
//   beyond a limit                                       → out_of_spec
// ILAC-G8's "conditional fail" (beyond a limit, within U of it) is out_of_spec here: a part
// the gauge says is outside never passes on the benefit of the doubt.
//
// Exactness: readings are decimal figures, but binary floats are not (4.0312 − 4.0302 is
// 0.0010000000000003 as a double). Every input is first rounded to 12 significant digits (far
// finer than any gauge, far coarser than float noise) and compared as exact decimals (decimal.js-light).
import Decimal from "decimal.js-light";
import type { MeasureUnit, Verdict } from "../../../../lib/domain/enums";
import type { ResolvedLimit } from "../../../../lib/domain/types";
import { DISPLAY_RESOLUTION } from "./units";
import { UNIT_WORDS } from "../../../../lib/domain/words";

const D = Decimal.clone({ precision: 40 });
type Dec = InstanceType<typeof D>;
const SIGNIFICANT_DIGITS = 12;

export interface VerdictInput {
  value: number;
  min?: number | null;
  max?: number | null;
  /** Expanded uncertainty U (k = 2), same unit as the value; 0 when unknown. */
  uncertainty?: number | null;
}

function exact(x: number, name: string): Dec {
  if (typeof x !== "number" || !Number.isFinite(x)) {
    throw new Error(`${name} must be a finite number; got ${String(x)}`);
  }
  return new D(x.toPrecision(SIGNIFICANT_DIGITS));
}

function optionalExact(x: number | null | undefined, name: string): Dec | undefined {
  return x === undefined || x === null ? undefined : exact(x, name);
}

interface ExactLimits {
  lo?: Dec;
  hi?: Dec;
  u: Dec;
}

function exactLimits(
  min: VerdictInput["min"],
  max: VerdictInput["max"],
  uncertainty: VerdictInput["uncertainty"],
): ExactLimits {
  const lo = optionalExact(min, "Lower limit");
  const hi = optionalExact(max, "Upper limit");
  if (!lo && !hi) throw new Error("A verdict needs at least one limit (min or max); add one to the spec");
  if (lo && hi && lo.gt(hi)) {
    throw new Error(`Lower limit ${String(min)} is above upper limit ${String(max)}; swap them on the spec`);
  }
  const u = optionalExact(uncertainty, "Uncertainty U") ?? new D(0);
  if (u.isNegative()) throw new Error(`Uncertainty U cannot be negative; got ${String(uncertainty)}`);
  return { lo, hi, u };
}

/** ISO 14253-1 verdict with a guard band of U. A value exactly on a limit with U = 0 is in_spec. */
export function verdict(input: VerdictInput): Verdict {
  if (input === null || typeof input !== "object") throw new Error("verdict needs { value, min?, max?, uncertainty? }");
  const v = exact(input.value, "Measured value");
  const { lo, hi, u } = exactLimits(input.min, input.max, input.uncertainty);
  if ((lo && v.lt(lo)) || (hi && v.gt(hi))) return "out_of_spec";
  if ((lo && v.lt(lo.plus(u))) || (hi && v.gt(hi.minus(u)))) return "marginal";
  return "in_spec";
}

/**
 * The conformance zone (ISO 14253-1:2017, 3.13 and 5.2): the limits moved inwards by U.
 * `empty` is true when U is so large that no reading could be in_spec (2U ≥ tolerance
 * is already a warning sign; 2U > tolerance leaves nothing).
 */
export function conformanceZone(
  limit: { min?: number | null; max?: number | null },
  uncertainty = 0,
): { min?: number; max?: number; empty: boolean } {
  const { lo, hi, u } = exactLimits(limit.min, limit.max, uncertainty);
  const zoneMin = lo?.plus(u);
  const zoneMax = hi?.minus(u);
  const empty = zoneMin !== undefined && zoneMax !== undefined && zoneMin.gt(zoneMax);
  return {
    ...(zoneMin !== undefined ? { min: zoneMin.toNumber() } : {}),
    ...(zoneMax !== undefined ? { max: zoneMax.toNumber() } : {}),
    empty,
  };
}

/**
 * Value minus the nominal size, exact to the gauge's figures. Without a written nominal the
 * middle of a two-sided tolerance stands in; one-sided limits have no nominal (undefined).
 */
export function deviationFromNominal(
  value: number,
  limit: Pick<ResolvedLimit, "min" | "max" | "nominal">,
): number | undefined {
  const v = exact(value, "Measured value");
  if (limit.nominal !== undefined && limit.nominal !== null) {
    return v.minus(exact(limit.nominal, "Nominal")).toNumber();
  }
  if (limit.min === undefined || limit.max === undefined || limit.min === null || limit.max === null) return undefined;
  const mid = exact(limit.min, "Lower limit").plus(exact(limit.max, "Upper limit")).div(2);
  return v.minus(mid).toNumber();
}

const STEP: Record<MeasureUnit, { per: string; singular: string; plural: string }> = {
  in: { per: DISPLAY_RESOLUTION.in, singular: "tenth", plural: "tenths" }, // a tenth of a thousandth of an inch
  mm: { per: DISPLAY_RESOLUTION.mm, singular: "µm", plural: "µm" },
  lbf_ft: { per: DISPLAY_RESOLUTION.lbf_ft, singular: UNIT_WORDS.lbf_ft, plural: UNIT_WORDS.lbf_ft },
  nm: { per: DISPLAY_RESOLUTION.nm, singular: UNIT_WORDS.nm, plural: UNIT_WORDS.nm },
};

/**
 * A deviation in the words the bench uses: inch work in tenths (0.0001 in), metric work in µm,
 * torque in its own unit; one decimal at most. 0.0003 in → "3 tenths over",
 * −0.012 mm → "12 µm under", 0 → "on nominal".
 */
export function formatDeviation(dev: number, unit: MeasureUnit): string {
  const step = STEP[unit];
  if (!step) throw new Error(`Unknown unit '${String(unit)}'; use in, mm, lbf_ft or nm`);
  const steps = exact(dev, "Deviation").div(step.per).toDecimalPlaces(1, Decimal.ROUND_HALF_UP);
  if (steps.isZero()) return "on nominal";
  const amount = steps.abs();
  const word = amount.eq(1) ? step.singular : step.plural;
  return `${amount.toString()} ${word} ${steps.isNegative() ? "under" : "over"}`;
}
