// From what was typed in a gauge study (keypad, keyboard or the gauge's own keystrokes) to a figure
// the run keeps, or words saying what to fix. The typed text stays on screen after a refusal.
import { dialDiameter, isDialBoreGauge, rangeHolds, unitWords } from "@/lib/domain";
import type { StudyReference } from "@/lib/domain/gauge-studies/types";
import { parseEntry, type Parsed } from "./entry";
import type { DraftGauge } from "./study-draft-shape";

/**
 * How far a reading of a reference may stand from its size, in steps of the gauge, before the
 * tablet takes it for a mistyped figure (a slipped decimal point, a wrong digit). Our own guard:
 * a gauge a hundred steps off its master is out of adjustment, not under study.
 */
export const STEPS_FROM_REFERENCE = 100;

const rangeWords = (g: DraftGauge) => `${g.rangeMin}–${g.rangeMax} ${unitWords(g.unit)}`;

/** A figure read with the gauge: a number, kept to the places the server stores, inside its range. */
export function parseGaugeFigure(text: string, gauge: DraftGauge, what = "the reading"): Parsed {
  const parsed = parseEntry(text, what);
  if ("error" in parsed) return parsed;
  if (!rangeHolds(gauge, parsed.value, gauge.unit))
    return {
      error: `${parsed.value} ${unitWords(gauge.unit)} is outside what ${gauge.label} reads (${rangeWords(gauge)})`,
    };
  return parsed;
}

/** A dial bore gauge is set on the reference, so each reading is typed as the dial shows it. */
function fromDial(text: string, gauge: DraftGauge, reference: StudyReference): Parsed {
  const dial = parseEntry(text, "the dial reading");
  if ("error" in dial) return dial;
  try {
    const value = dialDiameter({
      setting: reference.value,
      deviation: dial.value,
      plusMeansSmaller: gauge.dialPlusMeansSmaller,
    });
    return parseGaugeFigure(String(value), gauge);
  } catch (err) {
    return { error: err instanceof Error ? err.message : String(err) };
  }
}

/** A reading of the study's reference (a dial gauge's: the diameter its dial reading stands for), near its size. */
export function parseReferenceReading(text: string, gauge: DraftGauge, reference: StudyReference): Parsed {
  const parsed = isDialBoreGauge(gauge) ? fromDial(text, gauge, reference) : parseGaugeFigure(text, gauge);
  if ("error" in parsed) return parsed;
  const steps = Math.abs(parsed.value - reference.value) / gauge.resolution;
  if (steps > STEPS_FROM_REFERENCE)
    return {
      error:
        `${parsed.value} is ${Math.round(steps)} steps of the gauge from the reference's ${reference.value} ` +
        `${unitWords(gauge.unit)}; check the figure (the decimal point) and type it again`,
    };
  return parsed;
}

export type ReferenceFields = { value: string; expandedU: string; coverageK: string };
export type ReferenceProblems = Partial<Record<keyof ReferenceFields, string>>;

/** The reference as typed from its certificate: size, expanded U and its coverage factor k. */
export function parseReference(
  fields: ReferenceFields,
  gauge: DraftGauge,
): { reference: StudyReference } | { errors: ReferenceProblems } {
  const errors: ReferenceProblems = {};
  const size = parseGaugeFigure(fields.value, gauge, "the reference's size");
  if ("error" in size) errors.value = size.error;
  const u = parseEntry(fields.expandedU, "the certificate's U");
  if ("error" in u) errors.expandedU = u.error;
  else if (u.value <= 0) errors.expandedU = "Type the certificate's expanded uncertainty U, a figure above 0";
  else if ("value" in size && u.value >= Math.abs(size.value))
    errors.expandedU = "U is as large as the size itself; type U from the certificate, in the gauge's unit";
  const k = parseEntry(fields.coverageK, "the coverage factor k");
  if ("error" in k) errors.coverageK = k.error;
  else if (k.value < 1 || k.value > 4) errors.coverageK = "Type k from the certificate (usually 2), between 1 and 4";
  if ("error" in size || "error" in u || "error" in k || Object.keys(errors).length) return { errors };
  return { reference: { value: size.value, expandedU: u.value, coverageK: k.value } };
}
