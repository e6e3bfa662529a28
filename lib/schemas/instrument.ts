import { z } from "zod";
import {
  INSTRUMENT_KIND_IDS,
  INSTRUMENT_KINDS,
  MEASURE_UNITS,
  gaugeRangeProblem,
  quantityOfUnit,
  type MeasureUnit,
} from "@/lib/domain";
import type { SettingMasterRecord } from "./setting-master";
import { storedText } from "./stored-text";
import { GAUGE_FIGURE_PRECISION, keptBy } from "./stored-figure";

// One schema for the gauge form and the instruments routes, plus the
// calibration status words every screen uses.

// The instrument kinds themselves (what each reads, which spec-sheet gauge kind it is) are the core's
// table, lib/domain/gauges.ts, which also decides which gauges suit which station.

/** A gauge reads in one of the units readings are written in (words: UNIT_WORDS in lib/domain). */
export type InstrumentUnit = MeasureUnit;

const date = (what: string) =>
  z
    .string({ error: `Enter the ${what} date` })
    .regex(/^\d{4}-\d{2}-\d{2}$/, `Enter the ${what} date as YYYY-MM-DD`)
    .refine(
      (s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s),
      `That ${what} date does not exist`,
    );

const positive = (what: string) =>
  z
    .number({ error: `${what} must be a number` })
    .finite(`${what} must be a number`)
    .positive(`${what} must be above zero`);

const rangeEnd = (what: string) =>
  z
    .number({ error: `Enter ${what} as a number` })
    .finite(`Enter ${what} as a number`)
    .superRefine(keptBy(GAUGE_FIGURE_PRECISION, `${what[0].toUpperCase()}${what.slice(1)}`));
/** The range as stored and merged on an edit: a gauge registered before ranges were kept has none. */
const storedRangeEnd = (what: string) => rangeEnd(what).nullable();

/** The fields of a gauge as the admin enters them; U is the expanded uncertainty at k = 2. */
export const instrumentFields = z.object({
  kind: z.enum(INSTRUMENT_KIND_IDS, { error: "Choose what kind of gauge this is" }),
  label: storedText("The gauge's name", "Give the gauge a name people recognise")
    .trim()
    .min(1, "Give the gauge a name people recognise")
    .max(120, "Keep the name under 120 characters"),
  serial: storedText("The serial", "Enter the serial number engraved on the gauge")
    .trim()
    .min(1, "Enter the serial number engraved on the gauge")
    .max(64, "Keep the serial under 64 characters"),
  unit: z.enum(MEASURE_UNITS, { error: "Choose the unit the gauge reads: in, mm, lbf·ft or N·m" }),
  resolution: positive("Resolution").superRefine(keptBy(GAUGE_FIGURE_PRECISION, "Resolution")),
  expandedU: z
    .number({ error: "Expanded uncertainty U must be a number" })
    .finite("Expanded uncertainty U must be a number")
    .min(0, "Expanded uncertainty U cannot be negative")
    .superRefine(keptBy(GAUGE_FIGURE_PRECISION, "Expanded uncertainty U")),
  // The measuring range in the gauge's unit; null only on a gauge registered before ranges were kept.
  rangeMin: storedRangeEnd("the start of the measuring range"),
  rangeMax: storedRangeEnd("the top of the measuring range"),
  calibratedOn: date("calibration"),
  calibrationDue: date("calibration due"),
  dialPlusMeansSmaller: z.boolean({ error: "Say whether plus on the dial means a smaller bore" }),
});

type Fields = z.output<typeof instrumentFields>;
type Payload = { issues: { path?: PropertyKey[] }[] };
/** Run a cross-field rule only when its own fields are valid, so all errors show at once. */
const when =
  (...fields: (keyof Fields)[]) =>
  (p: Payload) =>
    p.issues.every((i) => !fields.includes(i.path?.[0] as keyof Fields));

const unitFits = (v: Fields) => {
  return quantityOfUnit(v.unit) === INSTRUMENT_KINDS[v.kind].quantity;
};

/** The core's plausibility of the range (gaugeRangeProblem), on the field it names. */
const rangeProblem = (v: Fields) =>
  v.rangeMin === null || v.rangeMax === null ? undefined : gaugeRangeProblem(v.kind, v.unit, v.rangeMin, v.rangeMax);
const rangeRule = (field: "rangeMin" | "rangeMax") => ({
  path: [field],
  error: (issue: { input?: unknown }) => rangeProblem(issue.input as Fields)?.message,
  when: when("kind", "unit", "rangeMin", "rangeMax"),
});

/** Rules across fields, shared by create (whole object) and edit (after merging with what is stored). */
export function withInstrumentRules<S extends z.ZodType<Fields>>(schema: S): S {
  return schema
    .refine(unitFits, {
      path: ["unit"],
      message: "The unit must fit the kind: a torque wrench reads lbf·ft or N·m, every other gauge in or mm",
      when: when("kind", "unit"),
    })
    .refine((v) => (v.rangeMin === null) === (v.rangeMax === null), {
      path: ["rangeMax"],
      message: "Enter both ends of the measuring range",
      when: when("rangeMin", "rangeMax"),
    })
    .refine((v) => rangeProblem(v)?.field !== "rangeMin", rangeRule("rangeMin"))
    .refine((v) => rangeProblem(v)?.field !== "rangeMax", rangeRule("rangeMax"))
    .refine((v) => v.calibrationDue > v.calibratedOn, {
      path: ["calibrationDue"],
      message: "The due date must come after the calibration date",
      when: when("calibratedOn", "calibrationDue"),
    })
    .refine((v) => !(v.expandedU > 100 * v.resolution), {
      path: ["expandedU"],
      message: "U is more than 100 times the resolution; check both figures and their unit",
      when: when("expandedU", "resolution"),
    }) as S;
}

/** A gauge registered or edited now states its range (what it reads: 20–150 lbf·ft, 4–5 in). */
const newRange = {
  rangeMin: rangeEnd("the start of the measuring range"),
  rangeMax: rangeEnd("the top of the measuring range"),
};

/** Registering: most dial bore gauges read plus for a smaller bore, so that is the default. */
export const instrumentSchema = withInstrumentRules(
  instrumentFields.extend({
    dialPlusMeansSmaller: instrumentFields.shape.dialPlusMeansSmaller.default(true),
    ...newRange,
  }),
);

/**
 * An edit: any of the fields, plus switching the gauge off or on. (A certificate is attached by
 * uploading it: POST /api/attachments with ownerType 'instrument' links it to the gauge.)
 */
export const instrumentPatchSchema = instrumentFields
  .partial()
  .extend({
    rangeMin: newRange.rangeMin.optional(),
    rangeMax: newRange.rangeMax.optional(),
    active: z.boolean({ error: "active must be true or false" }).optional(),
  })
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "Say what to change", path: ["_"] });

export type InstrumentValues = z.input<typeof instrumentSchema>;
export type InstrumentInput = z.output<typeof instrumentSchema>;
export type InstrumentPatch = z.output<typeof instrumentPatchSchema>;
/** A gauge's fields as stored (an edit is checked as a whole after merging with them). */
export type InstrumentFields = Fields;

export type CalibrationStatus = "in_calibration" | "due_soon" | "past_due";
export const DUE_SOON_DAYS = 30;
export const CALIBRATION_WORDS: Record<CalibrationStatus, string> = {
  in_calibration: "In calibration",
  due_soon: `Due within ${DUE_SOON_DAYS} days`,
  past_due: "Past due",
};

const dayNumber = (isoDate: string) => Math.floor(Date.parse(`${isoDate}T00:00:00Z`) / 86_400_000);

/**
 * Calibration status on `today` (YYYY-MM-DD): usable through its due date; past due from the
 * day after. Shop practice (from memory): a gauge is good through the due date on its sticker.
 */
export function calibrationStatus(due: string, today: string): { status: CalibrationStatus; daysLeft: number } {
  const daysLeft = dayNumber(due) - dayNumber(today);
  if (daysLeft < 0) return { status: "past_due", daysLeft };
  return { status: daysLeft <= DUE_SOON_DAYS ? "due_soon" : "in_calibration", daysLeft };
}

/** A gauge as the screens get it. */
export type InstrumentRecord = Fields & {
  id: number;
  coverageK: number;
  active: boolean;
  certificate: { id: string; name: string; url: string } | null;
  /** The setting master a repeatability study offers as its reference (lib/schemas/setting-master.ts). */
  master: SettingMasterRecord | null;
  status: CalibrationStatus;
  daysLeft: number;
};

/** GET /api/instruments?include=active|all */
export const instrumentListQuery = z.object({
  include: z.enum(["active", "all"], { error: "include must be active or all" }).default("active"),
});
