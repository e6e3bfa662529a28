// A job's build plan: the combination the lead intends to assemble. Stored as JSON on
// jobs.build_plan with its units written in, so the record reads the same years later:
// lengths in `lengthUnit` (the job's unit system: in or mm), volumes in cc (cm³), the rocker
// ratio as a plain ratio. Every figure may be left empty while the plan is being worked out;
// the page computes what the figures present allow.
import { z } from "zod";
import { storedText } from "./stored-text";
import { planFigureProblems } from "@/lib/domain";
import { UNIT_SYSTEMS, type UnitSystem } from "@/lib/schemas/enums";

export const PISTON_TOPS = ["flat", "dish", "dome"] as const;

const length = (what: string) =>
  z
    .number({ error: `Enter the ${what} as a number` })
    .positive(`The ${what} is above zero`)
    .max(2000, `Check the ${what}: it is too large`)
    .nullish();
const gap = (what: string) =>
  z
    .number({ error: `Enter the ${what} as a number` })
    .min(0, `The ${what} is 0 or more`)
    .max(100, `Check the ${what}: it is too large`)
    .nullish();
const cc = (what: string) =>
  z
    .number({ error: `Enter the ${what} in cc` })
    .min(0, `Enter the ${what} as a size (0 or more); pick dish or dome for its sign`)
    .max(5000, `Check the ${what}: it is too large`)
    .nullish();

export const buildPlanSchema = z
  .strictObject({
    format: z.literal("tenthwise.build-plan").default("tenthwise.build-plan"),
    version: z.literal(1).default(1),
    lengthUnit: z.enum(UNIT_SYSTEMS, { error: "The plan's length unit is in or mm" }),
    volumeUnit: z.literal("cc").default("cc"),
    bore: length("bore"),
    stroke: length("stroke"),
    rodLength: length("rod length (centre to centre)"),
    compressionHeight: length("piston compression height"),
    pistonTop: z.enum(PISTON_TOPS, { error: "Pick flat top, dish or dome" }),
    /** Dish or dome volume as a size; the sign comes from pistonTop (dish adds, dome takes away). */
    pistonVolumeCc: cc("dish or dome volume"),
    chamberCc: z
      .number({ error: "Enter the chamber volume in cc" })
      .min(0, "The chamber volume is 0 or more (0 for a flat head, or a diesel with its bowl in the piston)")
      .max(5000, "Check the chamber volume: it is too large")
      .nullish(),
    gasketBore: length("gasket bore"),
    gasketThickness: gap("gasket thickness (compressed)"),
    deckHeight: length("block deck height"),
    intakeLobeLift: length("intake lobe lift"),
    exhaustLobeLift: length("exhaust lobe lift"),
    rockerRatio: z
      .number({ error: "Enter the rocker ratio, e.g. 1.5" })
      .positive("The rocker ratio is above zero")
      .max(5, "Check the rocker ratio: it is usually 1.0 to 2.0")
      .nullish(),
    intakeLash: gap("intake lash"),
    exhaustLash: gap("exhaust lash"),
    notes: storedText("The notes").max(2000, "Keep notes to 2000 characters").nullish(),
  })
  .superRefine((p, ctx) => {
    if (p.pistonTop !== "flat" && (p.pistonVolumeCc === null || p.pistonVolumeCc === undefined)) {
      ctx.addIssue({
        code: "custom",
        path: ["pistonVolumeCc"],
        message: `Enter the ${p.pistonTop} volume in cc, or pick flat top`,
      });
    }
    if (typeof p.gasketBore === "number" && typeof p.bore === "number" && p.gasketBore < p.bore) {
      ctx.addIssue({
        code: "custom",
        path: ["gasketBore"],
        message: "The gasket bore is smaller than the bore; check both (a gasket bore is usually a little larger)",
      });
    }
    // Every size a real engine's, in the plan's unit (the core's ranges).
    for (const x of planFigureProblems(p)) ctx.addIssue({ code: "custom", path: [x.field], message: x.message });
  });

export type BuildPlanInput = z.input<typeof buildPlanSchema>;
export type BuildPlan = z.output<typeof buildPlanSchema>;

/** The piston's signed volume for the core: + for a dish, − for a dome, 0 for a flat top. */
export function pistonCcOf(plan: Pick<BuildPlan, "pistonTop" | "pistonVolumeCc">): number {
  const v = plan.pistonVolumeCc ?? 0;
  return plan.pistonTop === "dish" ? v : plan.pistonTop === "dome" ? -v : 0;
}

/** GET /api/jobs/:id/build-plan: the stored plan (null when none or no longer valid) and what it needs of the job. */
export type BuildPlanView = {
  plan: BuildPlan | null;
  /** finishedBore: the bore the job machines to, which a new plan starts from (else the engine's). */
  job: {
    id: number;
    code: string;
    title: string;
    status: string;
    unitSystem: UnitSystem;
    locked: boolean;
    finishedBore: number | null;
  };
  engine: { cylinders: number; nominalBore: number; nominalStroke: number; description: string };
};
