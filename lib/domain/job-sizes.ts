// Which of a job's sizes each characteristic's limit follows, and the limit context built from them.
//
// A job states the sizes it machines to (EngineShape.finishedSizes: the bore after overboring,
// the journals after grinding undersize); the engine keeps its design sizes (nominalSizes).
//   - A job-size tolerance (limit type job_size_tol) is a tolerance around the job's own size, for
//     the three sizes a job states: bore_diameter → finished bore, main_journal_diameter →
//     finished main journal, rod_journal_diameter → finished rod journal. A piston skirt is the
//     piston maker's size, not the job's (the bore is honed to suit the piston), so its fit to the
//     bore is judged as piston-to-wall clearance instead.
//   - A per-inch rule (ring gap, oil clearance, piston-to-wall) scales with the job's finished
//     size of the part it refers to (SIZE_OF); without one, with the measured diameter, and
//     without that, the engine's design size.
//   - An ISO 286 class without its own nominal takes the job's finished size as its basic size,
//     else the engine's design size.
import { lengthUnitOf } from "./bench-route";
import type { LimitContext } from "./limits";
import type { CharacteristicId, EngineShape, NominalSizes } from "./types";

export type JobSize = keyof NominalSizes;

/** The size a characteristic's per-inch rule or ISO 286 class refers to. */
export const SIZE_OF: Readonly<Partial<Record<CharacteristicId, JobSize>>> = {
  bore_diameter: "bore",
  piston_skirt_diameter: "bore",
  ring_end_gap: "bore",
  piston_to_wall: "bore",
  bore_taper: "bore",
  bore_out_of_round: "bore",
  main_journal_diameter: "mainJournal",
  main_bearing_bore: "mainJournal",
  main_oil_clearance: "mainJournal",
  main_journal_taper: "mainJournal",
  main_journal_out_of_round: "mainJournal",
  rod_journal_diameter: "rodJournal",
  rod_bearing_bore: "rodJournal",
  rod_oil_clearance: "rodJournal",
  rod_journal_taper: "rodJournal",
  rod_journal_out_of_round: "rodJournal",
};

/** The characteristics a job-size tolerance may judge, each with the job's size it follows. */
export const JOB_SIZE_OF: Readonly<Partial<Record<CharacteristicId, JobSize>>> = {
  bore_diameter: "bore",
  main_journal_diameter: "mainJournal",
  rod_journal_diameter: "rodJournal",
};

export const JOB_SIZES = ["bore", "mainJournal", "rodJournal"] as const satisfies readonly JobSize[];

/** Each finished size in words, as the job form and the limit notes say it. */
export const JOB_SIZE_WORDS: Readonly<Record<JobSize, string>> = {
  bore: "finished bore",
  mainJournal: "finished main journal size",
  rodJournal: "finished rod journal size",
};

/**
 * The limit context of a characteristic on this job: the job's finished size, the engine's design
 * size, and the diameter a per-inch rule scales with (rule at the top of this file). `measured`
 * is the diameter read on this job (a bore's mean for its ring gap, the journal of an oil clearance).
 */
export function limitContextFor(
  characteristic: CharacteristicId,
  engine: EngineShape,
  measured?: number,
): LimitContext {
  const unit = lengthUnitOf(engine);
  const size = SIZE_OF[characteristic];
  const nominal = size ? engine.nominalSizes?.[size] : undefined;
  const finished = size ? engine.finishedSizes?.[size] : undefined;
  const diameter = finished ?? measured ?? nominal;
  // Built by assignment, in this key order: spreads of optional objects cost more than the rest.
  const out: LimitContext = {};
  if (diameter !== undefined) out.diameter = { value: diameter, unit };
  if (nominal !== undefined) out.nominal = { value: nominal, unit };
  if (finished !== undefined) out.jobSize = { value: finished, unit };
  return out;
}

/**
 * A finished size against the engine's design size, in words: "0.030 in oversize",
 * "0.010 in undersize", "standard size". Both in `unit`; undefined when one is missing.
 */
export function sizeChangeWords(
  finished: number | null | undefined,
  nominal: number | null | undefined,
  unit: "in" | "mm",
): string | undefined {
  if (typeof finished !== "number" || typeof nominal !== "number") return undefined;
  if (!Number.isFinite(finished) || !Number.isFinite(nominal) || nominal <= 0) return undefined;
  // Shops say over and under sizes in thousandths of an inch or hundredths of a millimetre.
  const [places, least] = unit === "in" ? [4, 3] : [3, 2];
  const diff = Number((finished - nominal).toFixed(places));
  if (diff === 0) return "standard size";
  let amount = Math.abs(diff).toFixed(places);
  while (amount.split(".")[1].length > least && amount.endsWith("0")) amount = amount.slice(0, -1);
  return `${amount} ${unit} ${diff > 0 ? "oversize" : "undersize"}`;
}
