// Spec sheets: one limit, one template, and the template file format. The same schemas check
// the template editor (react-hook-form), the job limits editor, the route handlers and imports.
//
// ── The spec template file, format "tenthwise.spec-template", version 1 ──────────────────────
// Our own JSON format for moving a template between shops or keeping a copy. UTF-8 JSON:
//   {
//     "format": "tenthwise.spec-template",   // always this string
//     "version": 1,                          // this layout; a later layout gets a new number
//     "exportedAt": "2026-12-01T09:30:00Z",  // optional, ISO 8601, informational
//     "template": {
//       "name": "Street V8, cast iron block",   // 1–160 characters
//       "engineKind": "V8 gasoline",            // 1–64 characters, free text
//       "buildKind": "street",                  // 1–32: street, endurance, marine, diesel, … or your own
//       "unitSystem": "in",                     // "in" or "mm": the units the sheet is written in
//       "notes": "…",                           // optional
//       "limits": [                             // at least one
//         { "characteristic": "bore_diameter",  // an id of lib/domain CHARACTERISTICS
//           "stationPattern": "*",              // station ids with * (see spec-pattern.ts)
//           "limitType": "nominal_tol",         // min_max | nominal_tol | max_only | min_only | per_inch | iso286
//                                               // | job_size_tol
//           "unit": "in",                       // in | mm for lengths, lbf_ft | nm for torque
//           "nominal": 4.03, "tolPlus": 0.0004, "tolMinus": 0.0001,
//           "required": true,                   // must be measured before release
//           "gaugeKind": "dial-bore-gauge",     // optional: the instrument kind expected
//           "label": "Bore, finished size",     // optional
//           "commonPractice": true }            // optional: a typical figure, not the maker's (see
//                                               // lib/schemas/common-practice.ts for when it stays)
//       ]
//     }
//   }
// Fields each limit type needs (all numbers in "unit"; absent fields may be left out or null):
//   min_max      min and max (min ≤ max)          max_only   max          min_only   min
//   nominal_tol  nominal, tolPlus, tolMinus (tolerances as sizes ≥ 0; the minus one is subtracted)
//   per_inch     perInchMin and/or perInchMax: the limit per inch of diameter (also mm per mm)
//   iso286       isoClass (H5–H9, f g h js k m n p 5–9); nominal optional (else the job's finished
//                size for that characteristic, else the engine's size)
//   job_size_tol tolPlus, tolMinus (sizes ≥ 0) around the size the job states, not a fixed nominal:
//                bore_diameter → the job's finished bore, main_journal_diameter → its finished main
//                journal, rod_journal_diameter → its finished rod journal (lib/domain/job-sizes.ts).
//                "finished bore +0.0000/+0.0005 in" is tolPlus 0.0005, tolMinus 0.
// A clearance window (oil clearance, piston-to-wall, side clearance, end play, ring gap) is min_max
// on the derived clearance, or per_inch for one that scales with the job's finished bore or journal.
// Version 1 files written before job_size_tol existed read the same; the type is only added.
// Unknown fields are refused, so a typo never silently drops a limit.
import { z } from "zod";
import { storedText } from "./stored-text";
import {
  CHARACTERISTICS,
  GAUGE_KINDS,
  LIMIT_TYPES,
  MEASURE_UNITS,
  iso286Deviations,
  JOB_SIZE_OF,
  JOB_SIZE_WORDS,
  jobSizeToleranceProblems,
  limitFigureProblems,
  type CharacteristicId,
} from "@/lib/domain";
import { UNIT_SYSTEMS, type UnitSystem } from "@/lib/schemas/enums";
import { stationPatternProblem } from "./spec-pattern";
import { LIMIT_PRECISION, keptBy } from "./stored-figure";

export const CHARACTERISTIC_IDS = Object.keys(CHARACTERISTICS) as [CharacteristicId, ...CharacteristicId[]];
export const BUILD_KINDS = ["street", "endurance", "marine", "diesel", "drag", "vintage", "industrial"] as const;
export const SPEC_FILE_FORMAT = "tenthwise.spec-template";

export const LIMIT_TYPE_WORDS: Record<(typeof LIMIT_TYPES)[number], string> = {
  min_max: "Minimum and maximum",
  nominal_tol: "Nominal ± tolerances",
  max_only: "Maximum only",
  min_only: "Minimum only",
  per_inch: "Per inch of diameter",
  iso286: "ISO 286 class",
  job_size_tol: "Job's finished size ± tolerances",
};

/** The value fields each limit type uses; the others are cleared when a limit is stored. */
export const LIMIT_FIELDS = {
  min_max: ["min", "max"],
  nominal_tol: ["nominal", "tolPlus", "tolMinus"],
  max_only: ["max"],
  min_only: ["min"],
  per_inch: ["perInchMin", "perInchMax"],
  iso286: ["isoClass", "nominal"],
  job_size_tol: ["tolPlus", "tolMinus"],
} as const satisfies Record<(typeof LIMIT_TYPES)[number], readonly string[]>;
export type LimitValueField = (typeof LIMIT_FIELDS)[keyof typeof LIMIT_FIELDS][number];

type AddIssue = (path: string, message: string) => void;
function tolerances(l: { tolPlus?: number | null; tolMinus?: number | null }, add: AddIssue): void {
  for (const k of ["tolPlus", "tolMinus"] as const) {
    const v = l[k];
    if (typeof v !== "number") add(k, `Enter the ${k === "tolPlus" ? "plus" : "minus"} tolerance (0 if none)`);
    else if (v < 0) add(k, "Enter the tolerance as a size (0 or more); the minus one is subtracted for you");
  }
}

const num = (what: string) =>
  z.number({ error: `Enter the ${what} as a number` }).superRefine(keptBy(LIMIT_PRECISION, `The ${what}`));
const optNum = (what: string) => num(what).nullish();

export const limitSchema = z
  .strictObject({
    characteristic: z.enum(CHARACTERISTIC_IDS, { error: "Pick a characteristic from the list" }),
    stationPattern: storedText("The station pattern")
      .trim()
      .min(1, "Enter a station pattern; * means every station")
      .max(64, "Keep the pattern to 64 characters"),
    limitType: z.enum(LIMIT_TYPES, { error: "Pick a limit type" }),
    unit: z.enum(MEASURE_UNITS, { error: "Pick a unit: in, mm, lbf_ft or nm" }),
    min: optNum("minimum"),
    max: optNum("maximum"),
    nominal: optNum("nominal size"),
    tolPlus: optNum("plus tolerance"),
    tolMinus: optNum("minus tolerance"),
    perInchMin: optNum("minimum per inch"),
    perInchMax: optNum("maximum per inch"),
    isoClass: storedText("The ISO 286 class").trim().max(8, "An ISO 286 class is short, e.g. H7 or g6").nullish(),
    required: z.boolean({ error: "Say whether the limit is required" }),
    gaugeKind: z.enum(GAUGE_KINDS, { error: "Pick a gauge kind from the list" }).nullish(),
    label: storedText("The label").trim().max(120, "Keep the label to 120 characters").nullish(),
    commonPractice: z.boolean({ error: "commonPractice is true or false" }).nullish(),
  })
  .superRefine((l, ctx) => {
    const add = (path: string, message: string) => ctx.addIssue({ code: "custom", path: [path], message });
    const has = (v: number | null | undefined) => typeof v === "number";
    const info = CHARACTERISTICS[l.characteristic];
    const lengthUnit = l.unit === "in" || l.unit === "mm";
    if (info.kind === "torque" && lengthUnit) add("unit", "Torque is in lbf_ft or nm");
    if (info.kind === "length" && !lengthUnit) add("unit", `${info.label} is a length: use in or mm`);
    const problem = stationPatternProblem(l.characteristic, l.stationPattern);
    if (problem) add("stationPattern", problem);
    switch (l.limitType) {
      case "min_max":
        if (!has(l.min)) add("min", "Enter the minimum");
        if (!has(l.max)) add("max", "Enter the maximum");
        if (has(l.min) && has(l.max) && l.min! > l.max!) add("max", "The maximum is below the minimum; swap them");
        break;
      case "max_only":
        if (!has(l.max)) add("max", "Enter the maximum");
        break;
      case "min_only":
        if (!has(l.min)) add("min", "Enter the minimum");
        break;
      case "nominal_tol":
        if (!has(l.nominal)) add("nominal", "Enter the nominal size");
        tolerances(l, add);
        break;
      case "job_size_tol": {
        const size = JOB_SIZE_OF[l.characteristic];
        if (!size)
          add(
            "limitType",
            `A job states its size only for bores and main and rod journals; for ${info.label.toLowerCase()} ` +
              "pick nominal ± tolerances or minimum and maximum",
          );
        else if (!lengthUnit) add("unit", `The ${JOB_SIZE_WORDS[size]} is a length: use in or mm`);
        tolerances(l, add);
        break;
      }
      case "per_inch":
        if (info.kind === "torque") add("limitType", "A per-inch rule is for lengths, not torque; pick another type");
        if (!has(l.perInchMin) && !has(l.perInchMax))
          add("perInchMax", "Enter a minimum or a maximum per inch of diameter (e.g. 0.001)");
        for (const k of ["perInchMin", "perInchMax"] as const)
          if (has(l[k]) && l[k]! < 0) add(k, "A per-inch figure is 0 or more");
        if (has(l.perInchMin) && has(l.perInchMax) && l.perInchMin! > l.perInchMax!)
          add("perInchMax", "The maximum per inch is below the minimum; swap them");
        break;
      case "iso286":
        if (info.kind === "torque") add("limitType", "An ISO 286 class is for lengths, not torque; pick another type");
        if (!l.isoClass) add("isoClass", "Enter the ISO 286 class, e.g. H7 for a bore or g6 for a shaft");
        else {
          try {
            iso286Deviations(50, l.isoClass);
          } catch (err) {
            add("isoClass", (err as Error).message);
          }
        }
        if (has(l.nominal) && l.nominal! <= 0)
          add("nominal", "The nominal size is above zero (or leave it empty to use the job's finished size)");
        break;
    }
    // Every figure a real value of the characteristic could have, in its unit (the core's ranges).
    for (const p of [...limitFigureProblems(l), ...jobSizeToleranceProblems(l)]) add(p.field, p.message);
  });

export type LimitInput = z.input<typeof limitSchema>;
export type LimitValues = z.output<typeof limitSchema>;

/** A list of limits: at least one, and no two for the same characteristic and pattern. */
export const limitListSchema = z
  .array(limitSchema)
  .min(1, "Add at least one limit")
  .max(400, "A sheet holds at most 400 limits")
  .superRefine((limits, ctx) => {
    const seen = new Map<string, number>();
    limits.forEach((l, i) => {
      const key = `${l.characteristic}|${l.stationPattern.trim()}`;
      const first = seen.get(key);
      if (first === undefined) seen.set(key, i);
      else
        ctx.addIssue({
          code: "custom",
          path: [i, "stationPattern"],
          message:
            `Limit ${first + 1} already covers ${CHARACTERISTICS[l.characteristic].label.toLowerCase()} ` +
            `at '${l.stationPattern}'; change the pattern or remove one`,
        });
    });
  });

/**
 * PUT /api/jobs/[jobId]/limits: the job's whole limit set, and the revision it was edited from.
 * POST …/limits/preview takes the same body and answers what saving it would do. A change that
 * opens more than a handful of flags (isWideChange) is saved only with that number confirmed.
 */
export const jobLimitsSchema = z.strictObject({
  specRevision: z.number({ error: "Send the revision you edited (specRevision)" }).int().positive(),
  limits: limitListSchema,
  confirmedFlagsOpened: z
    .number({ error: "Send the number of flags you confirmed as a number" })
    .int()
    .min(0)
    .nullish(),
});
export type JobLimitsInput = z.input<typeof jobLimitsSchema>;
export type JobLimitsValues = z.output<typeof jobLimitsSchema>;

export const templateSchema = z.strictObject({
  name: storedText("The sheet's name")
    .trim()
    .min(1, "Give the sheet a name")
    .max(160, "Keep the name to 160 characters"),
  engineKind: storedText("The engine kind")
    .trim()
    .min(1, "Say which engine it is for, e.g. V8 gasoline")
    .max(64, "Keep it to 64 characters"),
  buildKind: storedText("The build")
    .trim()
    .min(1, "Say which build, e.g. street or marine")
    .max(32, "Keep it to 32 characters"),
  unitSystem: z.enum(UNIT_SYSTEMS, { error: "Pick in or mm" }),
  notes: storedText("The notes").max(2000, "Keep notes to 2000 characters").nullish(),
  limits: limitListSchema,
});

export type TemplateInput = z.input<typeof templateSchema>;
export type TemplateValues = z.output<typeof templateSchema>;

/** GET /api/specs: one line of the shop's spec sheets. */
export type TemplateSummary = {
  id: number;
  name: string;
  engineKind: string;
  buildKind: string;
  unitSystem: UnitSystem;
  version: number;
  archived: boolean;
  limitCount: number;
  updatedAt: string;
};
/** GET /api/specs/:id: a spec sheet with its limits, as the editor and the export use it. */
export type TemplateRecord = TemplateValues & { id: number; version: number; archived: boolean; updatedAt: string };

export const templateFileSchema = z.strictObject({
  format: z.literal(SPEC_FILE_FORMAT, {
    error: `This is not a Tenthwise spec template file: "format" must be "${SPEC_FILE_FORMAT}"`,
  }),
  version: z.literal(1, { error: "This file's version is not one this Tenthwise reads; it reads version 1" }),
  exportedAt: storedText("exportedAt").max(40).optional(),
  template: templateSchema,
});

export type TemplateFile = z.output<typeof templateFileSchema>;

/** A limit with its empty fields left out, as the file and the API send it. */
export function compactLimit(l: LimitValues): LimitValues {
  return Object.fromEntries(
    Object.entries(l).filter(([, v]) => v !== null && v !== undefined && v !== ""),
  ) as LimitValues;
}
