import { z } from "zod";
import { unitWords, type MeasureUnit } from "@/lib/domain";
import { storedText } from "./stored-text";
import { GAUGE_FIGURE_PRECISION, keptBy } from "./stored-figure";

// The setting master (a ring or gauge block) kept with a gauge: what a repeatability study on the
// tablet offers as its reference. Its figures are in the gauge's unit, U at k = 2 as on its certificate.
// PUT /api/instruments/:id/master sets or changes it, DELETE removes it; the admin's gauge page edits it.

/** A master's U at least this many gauge steps cannot show the gauge's own spread (see masterProblems). */
export const MASTER_U_MAX_STEPS = 10;

const figure = (what: string) =>
  z
    .number({ error: `Enter ${what} as a number` })
    .finite(`Enter ${what} as a number`)
    .positive(`${what[0].toUpperCase()}${what.slice(1)} must be above zero`)
    .superRefine(keptBy(GAUGE_FIGURE_PRECISION, `${what[0].toUpperCase()}${what.slice(1)}`));

export const settingMasterSchema = z
  .object({
    label: storedText("The master's name", "Name the master as it is marked, e.g. Ring 4.0300")
      .trim()
      .min(1, "Name the master as it is marked, e.g. Ring 4.0300")
      .max(120, "Keep the master's name under 120 characters"),
    size: figure("the master's size"),
    expandedU: figure("the certificate's expanded uncertainty U"),
  })
  .strict();

export type SettingMasterValues = z.input<typeof settingMasterSchema>;
export type SettingMasterInput = z.output<typeof settingMasterSchema>;

/** A gauge's setting master as the screens get it (InstrumentRecord.master). */
export type SettingMasterRecord = { label: string | null; size: number; expandedU: number };

/** What the master is checked against: the gauge it belongs to. */
export type MasterGauge = {
  unit: MeasureUnit;
  resolution: number;
  rangeMin: number | null;
  rangeMax: number | null;
};

type Problems = Partial<Record<"size" | "expandedU", string>>;

/**
 * The master against its gauge, in words on the field to fix: its size inside the gauge's measuring
 * range (a gauge is studied where it measures), and its U below MASTER_U_MAX_STEPS steps of the gauge,
 * so the reference is known well enough for the gauge's repeatability to show (a study compares the
 * gauge's spread with its step; a reference vaguer than that hides it). Form and server both ask it.
 */
export function masterProblems(m: { size: number; expandedU: number }, g: MasterGauge): Problems {
  const unit = unitWords(g.unit);
  const out: Problems = {};
  if (g.rangeMin !== null && g.rangeMax !== null && (m.size < g.rangeMin || m.size > g.rangeMax))
    out.size =
      `A master of ${m.size} ${unit} is outside this gauge's range, ${g.rangeMin}–${g.rangeMax} ${unit}; ` +
      `check the size and that it is in ${unit}`;
  if (m.expandedU >= MASTER_U_MAX_STEPS * g.resolution)
    out.expandedU =
      `U ${m.expandedU} ${unit} is ${MASTER_U_MAX_STEPS} or more of this gauge's steps (${g.resolution} ${unit}); ` +
      `check the certificate's figure and its unit, or use a better master`;
  return out;
}

/** The schema with the gauge's checks, for the form (the server runs masterProblems after loading the gauge). */
export function settingMasterSchemaFor(g: MasterGauge) {
  return settingMasterSchema.superRefine((m, ctx) => {
    for (const [field, message] of Object.entries(masterProblems(m, g)))
      ctx.addIssue({ code: "custom", path: [field], message });
  });
}
