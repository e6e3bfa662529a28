// Requests and answers of bearing shell selection. Figures are in the job's length unit (in or mm);
// the server refuses a shell or a housing bore in the other unit rather than convert it silently.
import { z } from "zod";
import type { JobStatus, LengthUnit, Verdict } from "@/lib/domain/enums";
import { storedText } from "./stored-text";
import { keptBy } from "./stored-figure";
import { PLAUSIBLE_WALL } from "./bearing-grades";
import {
  BEARING_ROLES,
  SHELL_STEP_KINDS,
  WALL_SOURCES,
  type BearingRole,
  type ShellStepKind,
  type WallSource,
} from "./bearing-enums";

/** bearing_shells and bearing_points figures: DECIMAL(10,6). */
export const BEARING_FIGURE_PRECISION = { digits: 10, places: 6 };

const figure = (what: string, max: number) =>
  z
    .number({ error: `Enter the ${what} as a number` })
    .positive(`The ${what} is above zero`)
    .max(max, `Check the ${what}: it is too large`)
    .superRefine(keptBy(BEARING_FIGURE_PRECISION, `The ${what}`));

const STEP_NEEDS_AMOUNT: readonly ShellStepKind[] = ["thicker", "thinner", "undersize"];

const count = (what: string) =>
  z
    .number({ error: `Enter how many ${what} halves are on hand` })
    .int("Count whole halves")
    .min(0, "Halves on hand are 0 or more")
    .max(999, "Check the count of halves");

export const shellInputSchema = z
  .strictObject({
    series: storedText("The series")
      .trim()
      .min(1, "Name the series (your own words)")
      .max(80, "Keep it to 80 characters"),
    role: z.enum(BEARING_ROLES, { error: "Pick main, thrust main or rod" }),
    step: z.enum(SHELL_STEP_KINDS, { error: "Pick standard, thicker, thinner, undersize or graded" }),
    stepAmount: figure("step amount", 50).nullish(),
    grade: storedText("The grade").trim().max(24, "Keep the grade to 24 characters").nullish(),
    wallSource: z.enum(WALL_SOURCES, { error: "Say where the wall comes from" }).nullish(),
    wall: figure("wall thickness", 20).nullish(),
    wallMin: figure("smallest wall of the grade", 20).nullish(),
    wallMax: figure("largest wall of the grade", 20).nullish(),
    wallUpper: figure("upper half's wall", 20).nullish(),
    wallLower: figure("lower half's wall", 20).nullish(),
    wallGaugeId: z.number().int().positive().nullish(),
    halvesUpper: count("upper"),
    halvesLower: count("lower"),
  })
  .superRefine((s, ctx) => {
    const add = (path: string, message: string) => ctx.addIssue({ code: "custom", path: [path], message });
    if (STEP_NEEDS_AMOUNT.includes(s.step) && !s.stepAmount) add("stepAmount", `Enter how much ${s.step} the set is`);
    if (s.step === "graded" && !s.grade) add("grade", "Enter the grade as marked on the shell");
    const needsWall = s.step === "standard" || s.step === "graded";
    if (!s.wallSource) {
      if (needsWall) add("wallSource", "A standard or graded set needs its wall: nominal, grade range or measured");
      return;
    }
    if (s.wallSource === "nominal" && !s.wall) add("wall", "Enter the wall of one half from the maker's sheet");
    if (s.wallSource === "range") {
      if (!s.wallMin || !s.wallMax) add("wallMin", "Enter the grade's smallest and largest wall");
      else if (s.wallMin > s.wallMax) add("wallMax", "The largest wall is at least the smallest");
    }
    if (s.wallSource === "measured") {
      if (!s.wallUpper) add("wallUpper", "Enter the upper half's wall as measured");
      if (!s.wallLower) add("wallLower", "Enter the lower half's wall as measured");
      if (!s.wallGaugeId) add("wallGaugeId", "Pick the ball micrometer the walls were measured with");
    }
  });
export type ShellInput = z.infer<typeof shellInputSchema>;

const WALL_FIELDS = ["wall", "wallMin", "wallMax", "wallUpper", "wallLower"] as const;

/**
 * Walls a shell of the job's unit cannot have (a figure typed in the other unit, or a slipped
 * decimal point), field by field, in words; the same bounds as a grade table's walls.
 */
export function implausibleWalls(input: ShellInput, unit: LengthUnit): Record<string, string[]> {
  const { min, max } = PLAUSIBLE_WALL[unit];
  const out: Record<string, string[]> = {};
  for (const field of WALL_FIELDS) {
    const v = input[field];
    if (v != null && (v < min || v > max))
      out[field] = [`A shell wall is between ${min} and ${max} ${unit}; check ${v} (the job is in ${unit})`];
  }
  return out;
}

/** A point is a main bearing ("main/3") or a rod's big end ("rod/5"). */
export const bearingPointId = z.string().regex(/^(main|rod)\/[1-9]\d{0,1}$/, "A point is main/<n> or rod/<n>");

export const housingsSchema = z.strictObject({
  points: z
    .array(
      z.strictObject({
        point: bearingPointId,
        housingBore: figure("housing bore", 2000).nullable(),
        housingGaugeId: z.number().int().positive().nullable(),
        thrust: z.boolean().default(false),
        housingCode: storedText("The housing code").trim().max(16, "Keep the code to 16 characters").nullish(),
        journalCode: storedText("The journal code").trim().max(16, "Keep the code to 16 characters").nullish(),
      }),
    )
    .max(40, "At most 40 bearing points"),
});
export type HousingsInput = z.infer<typeof housingsSchema>;

export const choiceSchema = z.strictObject({
  points: z
    .array(
      z.strictObject({
        point: bearingPointId,
        upperShellId: z.number().int().positive().nullable(),
        lowerShellId: z.number().int().positive().nullable(),
        byHand: z.boolean().default(false),
      }),
    )
    .max(40, "At most 40 bearing points"),
});
export type ChoiceInput = z.infer<typeof choiceSchema>;

export type ShellView = Omit<ShellInput, "stepAmount" | "grade" | "wallSource" | "wallGaugeId"> & {
  id: number;
  stepAmount: number | null;
  grade: string | null;
  wallSource: WallSource | null;
  wallGaugeId: number | null;
  /** Halves the saved choice uses, per position. */
  used: { upper: number; lower: number };
  unit: LengthUnit;
};

export type Clearance = { value: number; uncertainty: number | null; verdict: Verdict | null };

export type PointView = {
  point: string;
  label: string;
  role: BearingRole;
  /** The journal's station part ("main/3", or the crankpin "rod/2" a rod runs on). */
  journalPart: string;
  /** Smallest and largest current journal reading, with how many were read. */
  journal: { min: number; max: number; count: number } | null;
  housingBore: number | null;
  housingGaugeId: number | null;
  thrust: boolean;
  housingCode: string | null;
  journalCode: string | null;
  window: { min: number | null; max: number | null; target: number | null } | null;
  upperShellId: number | null;
  lowerShellId: number | null;
  byHand: boolean;
  predicted: Clearance | null;
  /** Installed bore minus journal from the bench, once the installed bore is read. */
  measured: Clearance | null;
};

export type BearingsView = {
  job: { id: number; code: string; title: string; unit: LengthUnit; locked: boolean; status: JobStatus };
  shells: ShellView[];
  points: PointView[];
  gauges: { id: number; label: string }[];
};

/** What a selection proposes, or what a hand change would move, before anything is saved. */
export type PointProposal = {
  point: string;
  upperShellId: number | null;
  lowerShellId: number | null;
  predicted: Clearance | null;
  /** Upper and lower halves from different sets. */
  mixed: boolean;
};
export type StockLeft = {
  shellId: number;
  used: { upper: number; lower: number };
  left: { upper: number; lower: number };
};
export type SelectionAnswer = {
  points: PointProposal[];
  /** Words for points the stock cannot bring into the window (nearest, what to do), and what points still need. */
  advice: string[];
  stock: StockLeft[];
  /** Points whose halves or predicted clearance differ from the saved choice, in words. */
  moved: string[];
  /** A hand choice the rules refuse (mixed series, steps too far apart, more halves than on hand). */
  problems: string[];
};
