import { z } from "zod";
import type {
  GaugeStudySummary,
  GrrMeasurement,
  GrrResult,
  StudyReference,
  StudyThresholds,
  Type1Result,
} from "@/lib/domain/gauge-studies/types";
import type { Consequences } from "@/lib/domain/consequences";
import type { StudyKind } from "./enums";
import type { ChangePreview } from "./job-views";
import { GAUGE_FIGURE_PRECISION, LIMIT_PRECISION, keptBy } from "./stored-figure";
import { storedText } from "./stored-text";

// Gauge studies as the routes take and give them. The server recomputes every figure with the core
// (lib/domain/gauge-studies): a request carries only what was measured, never a result.

/** A study as kept, for the gauge page, the tablet and the checklist; figures in `unit`. */
export type GaugeStudyRecord = {
  id: number;
  instrumentId: number;
  kind: StudyKind;
  performedOn: string;
  dueOn: string;
  performedBy: { id: number; name: string };
  unit: string;
  resolution: number;
  /** The setting master of a type 1 study; null on an R&R study. */
  reference: StudyReference | null;
  /** The R&R study's tolerance; null when none was given (and on a type 1 study). */
  tolerance: number | null;
  /** Type 1: the readings in order; R&R: one entry per reading. */
  readings: number[] | null;
  measurements: GrrMeasurement[] | null;
  /** R&R: appraisers' names, appraiser 1 first. */
  appraisers: string[] | null;
  passed: boolean;
  summary: GaugeStudySummary;
  thresholds: StudyThresholds;
  type1: Type1Result | null;
  grr: GrrResult | null;
  createdAt: string;
};

/** shops.study_min_cg, study_min_cgk: DECIMAL(4,2); study_max_*_pct: DECIMAL(5,2). */
const INDEX_PRECISION = { digits: 4, places: 2 };
const PCT_PRECISION = { digits: 5, places: 2 };

const finite = (what: string) => z.number({ error: `${what} must be a number` }).finite(`${what} must be a number`);

const figure = (what: string) => finite(what).superRefine(keptBy(LIMIT_PRECISION, what));

const characteristic = z.object({
  characteristic: storedText("The characteristic", "Name the characteristic")
    .trim()
    .min(1, "Name the characteristic")
    .max(48, "Keep the characteristic under 48 characters"),
  tolerance: figure("The tolerance").positive("The tolerance T must be above zero"),
});

const performedOn = z
  .string({ error: "Enter the study date as YYYY-MM-DD" })
  .regex(/^\d{4}-\d{2}-\d{2}$/, "Enter the study date as YYYY-MM-DD")
  .refine((s) => new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), "That study date does not exist");

/** A repeatability run: the readings in the order taken and the reference they measured. */
export const type1StudyInput = z.object({
  kind: z.literal("type1"),
  performedOn: performedOn.optional(),
  readings: z
    .array(figure("Each reading"), { error: "Send the readings as a list of numbers" })
    .max(50, "A repeatability study takes 25 to 50 readings; remove the extra ones"),
  reference: z.object({
    value: figure("The reference size"),
    expandedU: finite("The reference's U")
      .min(0, "The reference's U cannot be negative")
      .superRefine(keptBy(GAUGE_FIGURE_PRECISION, "The reference's U")),
    coverageK: finite("The coverage factor k").positive("The coverage factor k must be above zero").default(2),
  }),
  /** Extra characteristics to judge besides those the gauge is used for on open jobs. */
  characteristics: z.array(characteristic).max(20, "Judge at most 20 characteristics at once").default([]),
  /** A save that opens many flags is held back until this equals the number it opens (the preview says it). */
  confirmedFlagsOpened: z.number().int().min(0).nullish(),
});

const measurement = z.object({
  appraiser: z.number().int("Appraiser is counted 1, 2, 3").min(1).max(3, "At most 3 appraisers"),
  part: z.number().int("Part is counted 1, 2, …").min(1).max(10, "At most 10 parts"),
  trial: z.number().int("Trial is counted 1, 2, 3").min(1).max(3, "At most 3 trials"),
  value: figure("Each reading"),
});

/** An R&R study: every appraiser × part × trial, the appraisers' names, optionally a tolerance. */
export const grrStudyInput = z.object({
  kind: z.literal("grr"),
  performedOn: performedOn.optional(),
  appraisers: z
    .array(
      storedText("An appraiser's name", "Name each appraiser")
        .trim()
        .min(1, "Name each appraiser")
        .max(120, "Keep each name under 120 characters"),
    )
    .min(2, "An R&R study needs 2 or 3 appraisers")
    .max(3, "An R&R study needs 2 or 3 appraisers"),
  measurements: z.array(measurement).max(90, "At most 3 appraisers × 10 parts × 3 trials = 90 readings"),
  tolerance: figure("The tolerance").positive("The tolerance T must be above zero").optional(),
  confirmedFlagsOpened: z.number().int().min(0).nullish(),
});

export const studyInput = z.discriminatedUnion("kind", [type1StudyInput, grrStudyInput], {
  error: "Say which study this is: kind type1 (repeatability) or grr (R&R)",
});
export type StudyInput = z.output<typeof studyInput>;
export type Type1StudyInput = z.output<typeof type1StudyInput>;
export type GrrStudyInput = z.output<typeof grrStudyInput>;

/** What saving a study does to the open jobs the gauge was used on, in all and per job. */
export type StudyConsequences = ChangePreview & {
  jobs: { jobId: number; code: string; consequences: Consequences; words: string }[];
};
/** The preview: the study as it would be kept (no id yet) and its consequences. */
export type StudyPreview = StudyConsequences & { study: Omit<GaugeStudyRecord, "id"> & { id: null } };
export type StudySaved = StudyConsequences & { study: GaugeStudyRecord };

/** The shop's study thresholds as the admin edits them. */
export const studySettingsSchema = z.object({
  minCg: finite("Least Cg")
    .min(0.5, "Least Cg must be at least 0.5")
    .max(5, "Least Cg must be at most 5")
    .superRefine(keptBy(INDEX_PRECISION, "Least Cg")),
  minCgk: finite("Least Cgk")
    .min(0.5, "Least Cgk must be at least 0.5")
    .max(5, "Least Cgk must be at most 5")
    .superRefine(keptBy(INDEX_PRECISION, "Least Cgk")),
  maxResolutionPct: finite("Largest resolution")
    .positive("Largest resolution must be above 0 % of T")
    .max(50, "Largest resolution must be at most 50 % of T")
    .superRefine(keptBy(PCT_PRECISION, "Largest resolution")),
  maxGrrPct: finite("Largest %GRR")
    .positive("Largest %GRR must be above 0 %")
    .max(100, "Largest %GRR is at most 100 %")
    .superRefine(keptBy(PCT_PRECISION, "Largest %GRR")),
  validMonths: z
    .number({ error: "Months a study stays current must be a whole number" })
    .int("Months a study stays current must be a whole number")
    .min(1, "A study stays current for at least 1 month")
    .max(60, "A study stays current for at most 60 months"),
});
export type StudySettings = z.output<typeof studySettingsSchema>;
