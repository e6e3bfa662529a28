// A job as the lead creates or edits it: the customer (picked or new), the engine as it came
// in, the unit system, the template whose limits the job copies, due date and status. The
// form (react-hook-form) and POST/PATCH /api/jobs check with these same schemas.
import { z } from "zod";
import {
  ENGINE_LAYOUTS,
  EXPANSION_COEFFICIENTS,
  OPEN_JOB_STATUSES,
  checkEngineShape,
  engineSizeProblems,
  finishedSizeProblems,
} from "@/lib/domain";
import { FUELS, UNIT_SYSTEMS, type UnitSystem } from "@/lib/schemas/enums";
import { engineJournalFields, finishedSizesSchema } from "./job-sizes";
import { storedText } from "./stored-text";
import { ENGINE_SIZE_PRECISION, keptBy } from "./stored-figure";

/** Statuses the desk sets: the open ones; released and closed belong to the release step. */
export const DESK_STATUSES = OPEN_JOB_STATUSES;
export const MATERIALS = Object.keys(EXPANSION_COEFFICIENTS) as [
  keyof typeof EXPANSION_COEFFICIENTS,
  ...(keyof typeof EXPANSION_COEFFICIENTS)[],
];

const text = (max: number, what: string) =>
  storedText(`${what[0].toUpperCase()}${what.slice(1)}`)
    .trim()
    .max(max, `Keep ${what} to ${max} characters`)
    .nullish();
const whole = (what: string, lo: number, hi: number) =>
  z
    .number({ error: `Enter the ${what} as a whole number` })
    .int(`Enter the ${what} as a whole number`)
    .min(lo, `${what[0].toUpperCase()}${what.slice(1)}: ${lo} to ${hi}`)
    .max(hi, `${what[0].toUpperCase()}${what.slice(1)}: ${lo} to ${hi}`);
const size = (what: string) =>
  z
    .number({ error: `Enter the ${what} as a number` })
    .positive(`The ${what} is above zero`)
    .max(10000, `Check the ${what}: it is too large`)
    .superRefine(keptBy(ENGINE_SIZE_PRECISION, `The ${what}`));
const material = (what: string) => z.enum(MATERIALS, { error: `Pick the ${what} material from the list` });

// Plain (not strict) objects: the form keeps what was typed for the other choice, and the
// schema drops it, so switching between "known" and "new" loses nothing on screen.
export const customerPickSchema = z.discriminatedUnion(
  "mode",
  [
    z.object({
      mode: z.literal("existing"),
      id: z.number({ error: "Pick a customer" }).int().positive("Pick a customer"),
    }),
    z.object({
      mode: z.literal("new"),
      name: storedText("The customer's name")
        .trim()
        .min(1, "Enter the customer's name")
        .max(160, "Keep the name to 160 characters"),
      email: z
        .union([z.literal(""), storedText("The e-mail").trim().email("Enter an e-mail like name@example.com").max(255)])
        .nullish(),
      phone: text(40, "the phone number"),
    }),
  ],
  { error: "Pick a customer or enter a new one" },
);

export const engineSchema = z
  .strictObject({
    description: storedText("The engine's description")
      .trim()
      .min(1, "Describe the engine, e.g. small-block V8, 0.030 in over")
      .max(255, "Keep it to 255 characters"),
    cylinders: whole("number of cylinders", 1, 16),
    layout: z.enum(ENGINE_LAYOUTS, { error: "Pick inline, V or flat" }),
    mains: whole("number of main bearings", 1, 10),
    valvesPerCylinder: whole("valves per cylinder", 2, 5),
    ringsPerPiston: whole("rings per piston", 1, 4),
    boltsPerRod: whole("bolts per rod", 1, 4),
    nominalBore: size("nominal bore"),
    nominalStroke: size("nominal stroke"),
    ...engineJournalFields,
    blockMaterial: material("block"),
    headMaterial: material("head").nullish(),
    pistonMaterial: material("piston").nullish(),
    blockSerial: text(64, "the block serial"),
    crankSerial: text(64, "the crank serial"),
    headSerials: text(160, "the head serials"),
    fuel: z.enum(FUELS, { error: "Pick gasoline, diesel or other" }).nullish(),
  })
  .superRefine((e, ctx) => {
    if (e.layout !== "inline" && e.cylinders % 2 !== 0) {
      ctx.addIssue({
        code: "custom",
        path: ["cylinders"],
        message: `A ${e.layout === "v" ? "V" : "flat"} engine has an even number of cylinders`,
      });
      return;
    }
    // Anything else the core cannot measure (checked by the core itself, in its own words).
    try {
      checkEngineShape({
        cylinders: e.cylinders,
        layout: e.layout,
        mains: e.mains,
        valvesPerCylinder: e.valvesPerCylinder,
        ringsPerPiston: e.ringsPerPiston,
        boltsPerRod: e.boltsPerRod,
        unitSystem: "inch",
      });
    } catch (err) {
      ctx.addIssue({ code: "custom", path: ["cylinders"], message: (err as Error).message });
    }
  });

const isoDate = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, "Enter the date as YYYY-MM-DD")
  .refine(
    (d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)) && new Date(`${d}T00:00:00Z`).toISOString().startsWith(d),
    "That date does not exist",
  );

const jobFields = z.strictObject({
  code: storedText("The job code")
    .trim()
    .min(1, "Give the job a code, e.g. KF-2614")
    .max(24, "Keep the code to 24 characters")
    .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, "Use letters, digits, dots and dashes in the code"),
  title: storedText("The title").trim().min(1, "Give the job a title").max(160, "Keep the title to 160 characters"),
  customer: customerPickSchema,
  engine: engineSchema,
  unitSystem: z.enum(UNIT_SYSTEMS, { error: "Pick inch or metric" }),
  templateId: z
    .number({ error: "Pick the spec sheet the job starts from" })
    .int()
    .positive("Pick the spec sheet the job starts from"),
  dueDate: z.union([z.literal(""), isoDate]).nullish(),
  status: z.enum(DESK_STATUSES, { error: "Pick intake, measuring or review" }),
  notes: text(4000, "notes"),
  /** Left out: on create, the bore is taken as the engine's nominal; on edit, the stored sizes stay. */
  finishedSizes: finishedSizesSchema.optional(),
});

type SizedJob = {
  engine: z.output<typeof engineSchema>;
  unitSystem: UnitSystem;
  finishedSizes?: z.output<typeof finishedSizesSchema>;
};
/**
 * The engine's sizes and the job's finished sizes are real ones in the job's unit (a 40 in bore is
 * a slipped decimal point), and each finished size is near the engine's design size.
 */
function plausibleSizes(j: SizedJob, ctx: z.RefinementCtx) {
  const e = j.engine;
  for (const p of engineSizeProblems(e, j.unitSystem))
    ctx.addIssue({ code: "custom", path: ["engine", p.field], message: p.message });
  const design = {
    bore: e.nominalBore,
    mainJournal: e.nominalMainJournal ?? undefined,
    rodJournal: e.nominalRodJournal ?? undefined,
  };
  const given = j.finishedSizes ?? {};
  const finished = {
    bore: given.bore ?? undefined,
    mainJournal: given.mainJournal ?? undefined,
    rodJournal: given.rodJournal ?? undefined,
  };
  for (const p of finishedSizeProblems(finished, j.unitSystem, design))
    ctx.addIssue({ code: "custom", path: ["finishedSizes", p.size], message: p.message });
}

export const jobSchema = jobFields.superRefine(plausibleSizes);
/** Editing keeps the job's own limits (edit them on the limits page), so no template. */
export const jobEditSchema = jobFields
  .omit({ templateId: true })
  .extend({
    /** POST /api/jobs/:id/preview says how many flags a size change opens; a wide one is saved with that number. */
    confirmedFlagsOpened: z
      .number({ error: "Send the number of flags you confirmed as a number" })
      .int()
      .min(0)
      .nullish(),
  })
  .superRefine(plausibleSizes);

export type JobInput = z.input<typeof jobSchema>;
export type JobValues = z.output<typeof jobSchema>;
export type JobEditValues = z.output<typeof jobEditSchema>;

export const customerSchema = z.strictObject(customerPickSchema.options[1].omit({ mode: true }).shape);
export type CustomerValues = z.output<typeof customerSchema>;

export type * from "./job-views";
