// The words shown for units, verdicts, stations and characteristics. The bench, the desk, the
// release checklist, the build record, the CSV export and the mails all take them from here, so a
// figure reads the same on every screen and on paper.
import type { LengthUnit, MeasureUnit, Verdict } from "./enums";
import { describeStation } from "./station-words";
import { CHARACTERISTICS } from "./stations";

/** A unit as written after a figure. */
export const UNIT_WORDS: Readonly<Record<MeasureUnit, string>> = { in: "in", mm: "mm", lbf_ft: "lbf·ft", nm: "N·m" };

/** A unit as written after a figure; one the core does not know, as stored. */
export function unitWords(unit: string): string {
  return (UNIT_WORDS as Record<string, string | undefined>)[unit] ?? unit;
}

/** A unit system, named by its length unit as jobs and shops store it. */
export const UNIT_SYSTEM_WORDS: Readonly<Record<LengthUnit, string>> = {
  in: `Inch (${UNIT_WORDS.in}, ${UNIT_WORDS.lbf_ft})`,
  mm: `Metric (${UNIT_WORDS.mm}, ${UNIT_WORDS.nm})`,
};

/** A verdict on its own (a badge, a table cell, a column of the CSV). */
export const VERDICT_WORDS: Readonly<Record<Verdict, string>> = {
  in_spec: "In spec",
  marginal: "Marginal",
  out_of_spec: "Out of spec",
};

/** A verdict inside a line of text ("… · in spec · …"). */
export const verdictInText = (verdict: Verdict): string => VERDICT_WORDS[verdict].toLowerCase();

// A station's words depend on its id alone, and a job's page, export or audit page names each station
// many times: each id is worded once (bounded: an engine has a few hundred stations).
const STATION_WORDS = new Map<string, string>();

/** Words for a station ("Cylinder 3 · top of bore · axis A (thrust)"); an id the catalogue no longer knows, as stored. */
export function stationWords(id: string): string {
  let words = STATION_WORDS.get(id);
  if (words === undefined) {
    if (STATION_WORDS.size >= 10_000) STATION_WORDS.clear();
    try {
      words = describeStation(id);
    } catch {
      words = id;
    }
    STATION_WORDS.set(id, words);
  }
  return words;
}

/** A characteristic's name; an id the catalogue no longer knows, with spaces for its underscores. */
export function characteristicWords(id: string): string {
  return (CHARACTERISTICS as Record<string, { label: string } | undefined>)[id]?.label ?? id.replace(/_/g, " ");
}

/**
 * The mark on a starter sheet's limit (and a job limit copied from it) until the lead edits its
 * figures: the spec editor, the job page, the bench and the build record all show these words.
 */
export const COMMON_PRACTICE_WORDS = "Common practice — replace with the engine or part maker's specification";
