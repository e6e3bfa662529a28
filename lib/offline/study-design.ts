// The people, parts and trials of an R&R study as typed on the tablet, checked field by field.
import { GRR_DESIGN } from "@/lib/domain/gauge-studies";
import { parseEntry } from "./entry";
import type { GrrDesign } from "./study-draft-shape";

export type DesignFields = { appraisers: string[]; parts: number; trials: number; tolerance: string };
export type DesignProblems = Partial<Record<"appraisers" | "parts" | "trials" | "tolerance", string>>;

const NAME_MAX = 120;

export function parseDesign(fields: DesignFields): { design: GrrDesign } | { errors: DesignProblems } {
  const errors: DesignProblems = {};
  const names = fields.appraisers.map((n) => n.trim().normalize("NFC")).filter(Boolean);
  const { appraisers, parts, trials } = GRR_DESIGN;
  if (names.length < appraisers.min || names.length > appraisers.max)
    errors.appraisers = `Name ${appraisers.min} or ${appraisers.max} people who will each measure every part`;
  else if (new Set(names.map((n) => n.toLowerCase())).size !== names.length)
    errors.appraisers = "Each person once: two of the names are the same";
  else if (names.some((n) => n.length > NAME_MAX)) errors.appraisers = `Keep each name under ${NAME_MAX} characters`;
  if (!Number.isInteger(fields.parts) || fields.parts < parts.min || fields.parts > parts.max)
    errors.parts = `Pick ${parts.min} to ${parts.max} parts`;
  if (!Number.isInteger(fields.trials) || fields.trials < trials.min || fields.trials > trials.max)
    errors.trials = `Pick ${trials.min} or ${trials.max} trials`;
  let tolerance: number | null = null;
  if (fields.tolerance.trim()) {
    const t = parseEntry(fields.tolerance, "the tolerance");
    if ("error" in t) errors.tolerance = t.error;
    else if (t.value <= 0) errors.tolerance = "The tolerance T (upper limit − lower limit) must be above zero";
    else tolerance = t.value;
  }
  if (Object.keys(errors).length) return { errors };
  return { design: { appraisers: names, parts: fields.parts, trials: fields.trials, tolerance } };
}
