// What a gauge study in progress keeps on the tablet: enough to carry on after a reload, a lost
// network or someone else's turn on a shared tablet, and to send the study once it is complete.
import type { GrrMeasurement, StudyReference } from "@/lib/domain/gauge-studies/types";
import type { SettingMaster } from "@/lib/schemas/bench-gauges";

/** The gauge as the run names it (kept with the draft, so the run opens offline). */
export interface DraftGauge {
  id: number;
  /** The registered kind: a dial bore gauge is read as a dial reading from the reference it was set on. */
  kind: string;
  label: string;
  serial: string;
  unit: string;
  resolution: number;
  rangeMin?: number | null;
  rangeMax?: number | null;
  dialPlusMeansSmaller: boolean;
  /** The setting master on file with the gauge, offered as the reference. */
  master?: SettingMaster | null;
}

/** A repeatability run: one person reads one reference again and again. */
export interface Type1Draft {
  kind: "type1";
  gauge: DraftGauge;
  /** From the reference's certificate; null until typed. */
  reference: StudyReference | null;
  /** In the order taken, in the gauge's unit. */
  readings: number[];
}

/** People, parts and trials of an R&R study. */
export interface GrrDesign {
  /** Names as the study records them; the first is the person who entered it, if they appraise. */
  appraisers: string[];
  parts: number;
  trials: number;
  /** Tolerance T of the characteristic for %GRR against tolerance; null: against study variation only. */
  tolerance: number | null;
}

/** An R&R study: every appraiser measures every part in every trial. */
export interface GrrDraft {
  kind: "grr";
  gauge: DraftGauge;
  design: GrrDesign | null;
  /** In the order entered (always the first cells of `grrEntryOrder`). */
  measurements: GrrMeasurement[];
}

export type StudyDraft = Type1Draft | GrrDraft;
export type StudyKind = StudyDraft["kind"];
