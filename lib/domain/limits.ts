// Spec limits: which limit applies to a station, and what numbers it stands for.
//
// Station patterns (SpecLimit.stationPattern) are station ids (grammar in stations.ts) in
// which a segment may be "*":
//   - a "*" as the LAST segment matches one or more remaining segments:
//       "bore/*" matches "bore/3/top/A" and the per-cylinder "bore/3";
//       "*" alone matches every station;
//   - a "*" anywhere else matches exactly one segment: "bore/*/top/*" = the top of every bore;
//   - any other segment must be equal: "main/3/*" = everything on main 3.
// When several limits of one characteristic match a station, the most specific wins: most
// literal (non-"*") segments, then most segments, then the one listed first on the spec.
import { iso286Limits } from "./iso286";
import { JOB_SIZE_OF, JOB_SIZE_WORDS } from "./job-sizes";
import { MEASURE_UNITS, type LengthUnit, type MeasureUnit } from "./enums";
import type { CharacteristicId, Evaluation, ResolvedLimit, SpecLimit } from "./types";
import { cleanDecimal, convertLength, convertMeasure } from "./units";
import { deviationFromNominal, verdict } from "./verdict";

/** What a rule needs beyond the spec sheet, all lengths with their units. */
export interface LimitContext {
  /** The diameter a per-inch rule scales with (the journal for oil clearance, the bore for ring gap). */
  diameter?: { value: number; unit: LengthUnit };
  /** The engine's design size: the ISO 286 basic size when neither the limit nor the job gives one. */
  nominal?: { value: number; unit: LengthUnit };
  /** The job's finished size (job-sizes.ts): a job-size tolerance's nominal, an ISO 286 basic size. */
  jobSize?: { value: number; unit: LengthUnit };
}

function splitPattern(pattern: string): string[] {
  if (typeof pattern !== "string" || pattern.trim() === "") {
    throw new Error("A station pattern cannot be empty; use '*' for every station");
  }
  const parts = pattern.trim().split("/");
  if (parts.some((p) => p === "")) {
    throw new Error(`Station pattern '${pattern}' has an empty segment; remove the doubled or trailing '/'`);
  }
  return parts;
}

/** A pattern split once, with its specificity: most literal (non-"*") segments, then most segments. */
type CompiledPattern = { parts: readonly string[]; literal: number };

// Every reading of a batch looks its limit up over the whole spec; splitting each pattern again
// for each reading was the largest share of a sync batch's CPU in the core (bench:sync).
// Keyed by the text, so always right.
const compiledPatterns = new Map<string, CompiledPattern>();
function compilePattern(pattern: string): CompiledPattern {
  let c = compiledPatterns.get(pattern);
  if (!c) {
    const parts = splitPattern(pattern);
    c = { parts, literal: parts.filter((p) => p !== "*").length };
    if (compiledPatterns.size >= 2000) compiledPatterns.clear();
    compiledPatterns.set(pattern, c);
  }
  return c;
}

function matchParts(want: readonly string[], have: readonly string[]): boolean {
  const last = want.length - 1;
  if (want[last] === "*") {
    if (have.length < want.length) return false;
  } else if (have.length !== want.length) {
    return false;
  }
  for (let i = 0; i <= last; i++) if (want[i] !== "*" && want[i] !== have[i]) return false;
  return true;
}

/** True when the pattern covers the station id (rule at the top of this file). */
export function matchStationPattern(pattern: string, stationId: string): boolean {
  return matchParts(compilePattern(pattern).parts, stationId.split("/"));
}

/** The limit of `characteristic` that applies to `stationId`, or undefined when the spec has none. */
export function findLimit(
  spec: SpecLimit[],
  characteristic: CharacteristicId,
  stationId: string,
): SpecLimit | undefined {
  let have: string[] | undefined; // split only once a limit of the characteristic is met (most are not)
  let best: SpecLimit | undefined;
  let bestScore: [number, number] = [-1, -1];
  for (const limit of spec) {
    if (limit.characteristic !== characteristic) continue;
    const { parts, literal } = compilePattern(limit.stationPattern);
    if (!matchParts(parts, (have ??= stationId.split("/")))) continue;
    const better = literal > bestScore[0] || (literal === bestScore[0] && parts.length > bestScore[1]);
    if (better) {
      best = limit;
      bestScore = [literal, parts.length];
    }
  }
  return best;
}

function nameOf(limit: SpecLimit): string {
  return limit.label ?? `${limit.characteristic} (${limit.stationPattern})`;
}

function need(limit: SpecLimit, field: keyof SpecLimit, what: string): number {
  const x = limit[field];
  if (typeof x !== "number" || !Number.isFinite(x)) {
    throw new Error(`Limit '${nameOf(limit)}' is ${limit.limitType} but has no ${what} (${String(field)}); enter it`);
  }
  return x;
}

function ordered(limit: SpecLimit, min: number, max: number): ResolvedLimit {
  if (min > max) {
    throw new Error(`Limit '${nameOf(limit)}' has its minimum ${min} above its maximum ${max}; swap them`);
  }
  return { unit: limit.unit, min, max };
}

function lengthUnitOf(limit: SpecLimit): LengthUnit {
  if (limit.unit !== "in" && limit.unit !== "mm") {
    throw new Error(
      `Limit '${nameOf(limit)}' is ${limit.limitType}, which only works for lengths (in or mm), not ${limit.unit}`,
    );
  }
  return limit.unit;
}

function resolveNominalTol(limit: SpecLimit, nominal = need(limit, "nominal", "nominal size")): ResolvedLimit {
  const plus = need(limit, "tolPlus", "plus tolerance");
  const minus = need(limit, "tolMinus", "minus tolerance");
  if (plus < 0 || minus < 0) {
    throw new Error(
      `Limit '${nameOf(limit)}': give tolPlus and tolMinus as sizes (both ≥ 0); the minus one is subtracted`,
    );
  }
  return { unit: limit.unit, nominal, min: cleanDecimal(nominal - minus), max: cleanDecimal(nominal + plus) };
}

// A tolerance around the size the job states, e.g. "finished bore +0.0000/+0.0005 in".
// Why a job-size limit cannot be worked out here, or undefined when it can.
function jobSizeProblem(limit: SpecLimit, context: LimitContext): string | undefined {
  const size = JOB_SIZE_OF[limit.characteristic];
  if (!size) {
    return (
      `Limit '${nameOf(limit)}' follows the job's finished size, which a job states only for bores and ` +
      "main and rod journals; use nominal ± tolerances or a clearance window here"
    );
  }
  const stated = context.jobSize;
  if (!stated || !Number.isFinite(stated.value) || stated.value <= 0) {
    return `Limit '${nameOf(limit)}' follows the job's ${JOB_SIZE_WORDS[size]}; enter it on the job`;
  }
  return undefined;
}

function resolveJobSizeTol(limit: SpecLimit, context: LimitContext): ResolvedLimit {
  const problem = jobSizeProblem(limit, context);
  if (problem) throw new Error(problem);
  const stated = context.jobSize!;
  return resolveNominalTol(limit, cleanDecimal(convertLength(stated.value, stated.unit, lengthUnitOf(limit))));
}

function resolvePerInch(limit: SpecLimit, context: LimitContext): ResolvedLimit {
  const unit = lengthUnitOf(limit);
  const lo = limit.perInchMin;
  const hi = limit.perInchMax;
  if (lo === undefined && hi === undefined) {
    throw new Error(
      `Limit '${nameOf(limit)}' is per inch of diameter but has neither perInchMin nor perInchMax; enter one`,
    );
  }
  const d = context.diameter;
  if (!d || !Number.isFinite(d.value) || d.value <= 0) {
    throw new Error(
      `Limit '${nameOf(limit)}' is per inch of diameter and needs that diameter; ` +
        "measure it or enter the finished size on the job",
    );
  }
  // "Per inch of diameter" is a ratio (in per in = mm per mm), so the diameter only has to be
  // in the limit's own unit: a 55.88 mm journal becomes 2.2 in before an inch rule applies.
  const dia = convertLength(d.value, d.unit, unit);
  const min = lo === undefined ? undefined : cleanDecimal(lo * dia);
  const max = hi === undefined ? undefined : cleanDecimal(hi * dia);
  if (min !== undefined && max !== undefined) return ordered(limit, min, max);
  return { unit, ...(min !== undefined ? { min } : {}), ...(max !== undefined ? { max } : {}) };
}

function resolveIso286(limit: SpecLimit, context: LimitContext): ResolvedLimit {
  const unit = lengthUnitOf(limit);
  if (!limit.isoClass)
    throw new Error(`Limit '${nameOf(limit)}' is ISO 286 but has no tolerance class (e.g. H7, g6); enter one`);
  // The limit's own nominal, else the job's finished size, else the engine's design size.
  const given = limit.nominal !== undefined ? { value: limit.nominal, unit } : (context.jobSize ?? context.nominal);
  if (!given || !Number.isFinite(given.value)) {
    throw new Error(
      `Limit '${nameOf(limit)}' is ISO 286 and needs a nominal size; ` +
        "enter it on the limit or a finished size on the job",
    );
  }
  const nominalMm = cleanDecimal(convertLength(given.value, given.unit, "mm"));
  const mm = iso286Limits(nominalMm, limit.isoClass);
  const back = (x: number) => cleanDecimal(convertLength(x, "mm", unit));
  return { unit, nominal: back(nominalMm), min: back(mm.min), max: back(mm.max) };
}

/** Turns a spec limit into plain numbers in the limit's unit; throws saying what is missing. */
export function resolveLimit(limit: SpecLimit, context: LimitContext = {}): ResolvedLimit {
  if (!(MEASURE_UNITS as readonly string[]).includes(limit.unit)) {
    throw new Error(`Limit '${nameOf(limit)}' has unknown unit '${String(limit.unit)}'; use in, mm, lbf_ft or nm`);
  }
  switch (limit.limitType) {
    case "min_max":
      return ordered(limit, need(limit, "min", "minimum"), need(limit, "max", "maximum"));
    case "nominal_tol":
      return resolveNominalTol(limit);
    case "max_only":
      return { unit: limit.unit, max: need(limit, "max", "maximum") };
    case "min_only":
      return { unit: limit.unit, min: need(limit, "min", "minimum") };
    case "per_inch":
      return resolvePerInch(limit, context);
    case "iso286":
      return resolveIso286(limit, context);
    case "job_size_tol":
      return resolveJobSizeTol(limit, context);
    default:
      throw new Error(
        `Limit '${nameOf(limit)}' has unknown type '${String(limit.limitType)}'; ` +
          "use min_max, nominal_tol, max_only, min_only, per_inch, iso286 or job_size_tol",
      );
  }
}

/** The resolved limit of a characteristic at a station, or a note saying why there is none. */
export function limitsFor(
  spec: SpecLimit[],
  characteristic: CharacteristicId,
  stationId: string,
  context: LimitContext = {},
): { limits?: ResolvedLimit; note?: string } {
  return limitOrNote(findLimit(spec, characteristic, stationId), characteristic, stationId, context);
}

/** limitsFor once the limit is found: with one, the same for every station it covers in one context. */
export function limitOrNote(
  limit: SpecLimit | undefined,
  characteristic: CharacteristicId,
  stationId: string,
  context: LimitContext = {},
): { limits?: ResolvedLimit; note?: string } {
  if (!limit) return { note: `The spec has no limit for ${characteristic} at ${stationId}` };
  try {
    return { limits: resolveLimit(limit, context) };
  } catch (err) {
    return { note: err instanceof Error ? err.message : String(err) };
  }
}

/** `value` in `to` cleaned of float noise, or undefined when one is a length and the other a torque. */
function convert(value: number, from: MeasureUnit, to: MeasureUnit): number | undefined {
  if (from === to) return value;
  const out = convertMeasure(value, from, to);
  return out === undefined ? undefined : cleanDecimal(out);
}

/**
 * Judges a value (in `unit`, with expanded uncertainty U in the same unit) against resolved
 * limits: the value and U are brought into the limits' unit first, so the limit stays exactly
 * as the spec wrote it.
 */
export function judge(
  value: number,
  unit: MeasureUnit,
  uncertainty: number | undefined,
  limits: ResolvedLimit,
): Evaluation {
  const v = convert(value, unit, limits.unit);
  if (v === undefined) {
    return { value, unit, note: `The limit is in ${limits.unit} but the value is in ${unit}; fix the spec unit` };
  }
  const u = uncertainty === undefined ? undefined : convert(uncertainty, unit, limits.unit);
  const deviation = deviationFromNominal(v, limits);
  return {
    verdict: verdict({ value: v, min: limits.min, max: limits.max, uncertainty: u }),
    limits,
    value: v,
    unit: limits.unit,
    ...(deviation !== undefined ? { deviation } : {}),
    ...(u !== undefined ? { uncertainty: u } : {}),
  };
}
