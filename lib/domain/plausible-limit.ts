// Plausibility of the figures a person types outside the bench: a spec limit, a job's engine sizes
// and a build plan. The same ranges as readings (plausible-range.ts), so a limit can never ask for
// a value no reading could have, and a slipped decimal point is refused where it is typed.
import { CHARACTERISTICS } from "./stations";
import type { LengthUnit, LimitType, MeasureUnit } from "./enums";
import {
  NOMINAL_BORE_SLACK,
  canonical,
  farFromNominalBore,
  figureProblem,
  plausibleRange,
  rangeWords,
  type Range,
} from "./plausible-range";
import type { CharacteristicId, EngineShape, NominalSizes } from "./types";
import { cleanDecimal } from "./units";

/** A refusal on one field of a form, in words that say what to fix. */
export type FieldProblem = { field: string; message: string };

/** The figures of one limit, as the spec sheet and the job's limits write them. */
export type LimitFigures = {
  characteristic: CharacteristicId;
  unit: MeasureUnit;
  limitType: LimitType;
  min?: number | null;
  max?: number | null;
  nominal?: number | null;
  tolPlus?: number | null;
  tolMinus?: number | null;
  perInchMin?: number | null;
  perInchMax?: number | null;
};

/**
 * A limit per inch of diameter (also mm per mm): ring gaps run about 0.003–0.007 and oil
 * clearances about 0.001 per inch (common practice, from memory); 0.02 is far above any of them.
 */
export const PER_INCH_RANGE: Range = { min: 0, max: 0.02 };

const num = (v: number | null | undefined): v is number => typeof v === "number" && Number.isFinite(v);
const suitsKind = (l: LimitFigures) =>
  (CHARACTERISTICS[l.characteristic].kind === "length") === (l.unit === "in" || l.unit === "mm");

/** Every figure of the limit inside its characteristic's plausible range, in its unit. */
export function limitFigureProblems(l: LimitFigures): FieldProblem[] {
  if (!CHARACTERISTICS[l.characteristic] || !suitsKind(l)) return []; // the schema names those
  const out: FieldProblem[] = [];
  const check = (field: string, value: number | null | undefined) => {
    const why = num(value) ? figureProblem(l.characteristic, value, l.unit) : undefined;
    if (why) out.push({ field, message: why });
  };
  if (l.limitType === "min_max" || l.limitType === "min_only") check("min", l.min);
  if (l.limitType === "min_max" || l.limitType === "max_only") check("max", l.max);
  if (l.limitType === "iso286" && num(l.nominal) && l.nominal > 0) check("nominal", l.nominal);
  if (l.limitType === "nominal_tol" && num(l.nominal)) {
    const before = out.length;
    check("nominal", l.nominal);
    if (out.length === before) toleranceProblems(l, l.nominal, out);
  }
  if (l.limitType === "per_inch") {
    for (const field of ["perInchMin", "perInchMax"] as const) {
      const v = l[field];
      if (num(v) && v > PER_INCH_RANGE.max)
        out.push({
          field,
          message:
            `${v} per inch of diameter is far more than any real limit (at most ${PER_INCH_RANGE.max}); ` +
            "check the decimal point",
        });
    }
  }
  return out;
}

function toleranceProblems(l: LimitFigures, nominal: number, out: FieldProblem[]) {
  const range = plausibleRange(l.characteristic);
  const kind = CHARACTERISTICS[l.characteristic].kind;
  const edges = [
    ["tolMinus", l.tolMinus, -1],
    ["tolPlus", l.tolPlus, 1],
  ] as const;
  for (const [field, tol, sign] of edges) {
    if (!num(tol) || tol < 0) continue; // the schema refuses a negative tolerance
    const edge = canonical(nominal + sign * tol, l.unit);
    if (edge >= range.min && edge <= range.max) continue;
    const side = sign < 0 ? "lower" : "upper";
    out.push({
      field,
      message:
        `This tolerance puts the ${side} limit at ${cleanDecimal(nominal + sign * tol)} ${l.unit}, outside a real ` +
        `${CHARACTERISTICS[l.characteristic].label.toLowerCase()} (${rangeWords(range, kind)}); check it`,
    });
  }
}

/** Bore and skirt limits near the engine's nominal bore, as readings are. */
export function limitEngineProblems(
  l: LimitFigures,
  engine: Pick<EngineShape, "unitSystem" | "nominalSizes">,
): FieldProblem[] {
  if (l.characteristic !== "bore_diameter" && l.characteristic !== "piston_skirt_diameter") return [];
  if (l.unit !== "in" && l.unit !== "mm") return [];
  const fields =
    l.limitType === "nominal_tol" || l.limitType === "iso286" ? (["nominal"] as const) : (["min", "max"] as const);
  const out: FieldProblem[] = [];
  for (const field of fields) {
    const v = l[field];
    const why = num(v) ? farFromNominalBore(v, l.unit, engine) : undefined;
    if (why) out.push({ field, message: why });
  }
  return out;
}

/**
 * Engine and build-plan sizes that are not measured at a station, in mm (common practice, from
 * memory; deliberately wide, from small single-cylinder engines to big industrial diesels).
 */
export const SIZE_RANGES = {
  stroke: { min: 20, max: 600 },
  rodLength: { min: 50, max: 1500 },
  compressionHeight: { min: 5, max: 300 },
  gasketThickness: { min: 0, max: 5 },
  lobeLift: { min: 0, max: 30 },
} as const satisfies Record<string, Range>;
export type SizeKind = keyof typeof SIZE_RANGES;

const SIZE_WORDS: Record<SizeKind, string> = {
  stroke: "stroke",
  rodLength: "rod length",
  compressionHeight: "piston compression height",
  gasketThickness: "gasket thickness",
  lobeLift: "lobe lift",
};

/** Why a size cannot be real (outside SIZE_RANGES), or undefined. */
export function sizeProblem(kind: SizeKind, value: number, unit: LengthUnit): string | undefined {
  const range = SIZE_RANGES[kind];
  const v = canonical(value, unit);
  if (v >= range.min && v <= range.max) return undefined;
  const words = rangeWords(range, "length");
  return `${value} ${unit} cannot be a ${SIZE_WORDS[kind]}: a real one is ${words}. Check the decimal point and the unit`;
}

/** A job's engine as typed: the nominal bore a real bore, the nominal stroke a real stroke. */
export function engineSizeProblems(
  e: {
    nominalBore?: number | null;
    nominalStroke?: number | null;
    nominalMainJournal?: number | null;
    nominalRodJournal?: number | null;
  },
  unit: LengthUnit,
): FieldProblem[] {
  const out: FieldProblem[] = [];
  const bore =
    num(e.nominalBore) && e.nominalBore > 0 ? figureProblem("bore_diameter", e.nominalBore, unit) : undefined;
  if (bore) out.push({ field: "nominalBore", message: bore });
  const stroke = num(e.nominalStroke) && e.nominalStroke > 0 ? sizeProblem("stroke", e.nominalStroke, unit) : undefined;
  if (stroke) out.push({ field: "nominalStroke", message: stroke });
  const journals = [
    ["nominalMainJournal", "main_journal_diameter"],
    ["nominalRodJournal", "rod_journal_diameter"],
  ] as const;
  for (const [field, c] of journals) {
    const v = e[field];
    const why = num(v) && v > 0 ? figureProblem(c, v, unit) : undefined;
    if (why) out.push({ field, message: why });
  }
  return out;
}

/**
 * A tolerance around the job's own size (job_size_tol) is thousandths of an inch; one over 1 mm
 * (0.039 in) is a slipped decimal point (common practice, from memory).
 */
export const JOB_SIZE_TOLERANCE_MAX_MM = 1;

/** The tolerances of a job_size_tol limit: no larger than a real one. */
export function jobSizeToleranceProblems(l: LimitFigures): FieldProblem[] {
  if (l.limitType !== "job_size_tol" || (l.unit !== "in" && l.unit !== "mm")) return [];
  const out: FieldProblem[] = [];
  for (const field of ["tolPlus", "tolMinus"] as const) {
    const v = l[field];
    if (num(v) && v > 0 && canonical(v, l.unit) > JOB_SIZE_TOLERANCE_MAX_MM)
      out.push({
        field,
        message:
          `${v} ${l.unit} is far wider than a tolerance on a finished size (at most ` +
          `${rangeWords({ min: 0, max: JOB_SIZE_TOLERANCE_MAX_MM }, "length")}); check the decimal point and the unit`,
      });
  }
  return out;
}

const SIZE_CHARACTERISTIC: Record<keyof NominalSizes, CharacteristicId> = {
  bore: "bore_diameter",
  mainJournal: "main_journal_diameter",
  rodJournal: "rod_journal_diameter",
};
const SIZE_NAMES: Record<keyof NominalSizes, string> = {
  bore: "bore",
  mainJournal: "main journal size",
  rodJournal: "rod journal size",
};

/**
 * A job's finished sizes (in `unit`): each a real one, and within NOMINAL_BORE_SLACK of the
 * engine's design size when the engine states it (an overbore or an undersize grind is a few
 * hundredths of an inch, never a tenth of the size).
 */
export function finishedSizeProblems(
  finished: NominalSizes,
  unit: LengthUnit,
  nominal: NominalSizes = {},
): { size: keyof NominalSizes; message: string }[] {
  const out: { size: keyof NominalSizes; message: string }[] = [];
  for (const size of Object.keys(SIZE_CHARACTERISTIC) as (keyof NominalSizes)[]) {
    const v = finished[size];
    if (!num(v) || v <= 0) continue;
    const real = figureProblem(SIZE_CHARACTERISTIC[size], v, unit);
    if (real) {
      out.push({ size, message: real });
      continue;
    }
    const design = nominal[size];
    if (!num(design) || design <= 0) continue;
    const diff = Math.abs(canonical(v, unit) - canonical(design, unit));
    if (diff > NOMINAL_BORE_SLACK * canonical(design, unit) + 1e-9)
      out.push({
        size,
        message:
          `${v} ${unit} is more than ${NOMINAL_BORE_SLACK * 100}% away from the engine's ${design} ${unit} ` +
          `${SIZE_NAMES[size]}. Check the decimal point and the unit`,
      });
  }
  return out;
}
