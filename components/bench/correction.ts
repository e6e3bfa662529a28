// A figure saved at a station that already holds a kept reading replaces it (a correction). The
// route moves on after each entry, so that only happens on purpose, except where it stays: at
// the last open station, or after a jump back. There a gauge's next figure would replace the
// reading without a word, so the bench asks first: the same figure saved again records it.
import { UNIT_WORDS, VERDICT_WORDS, type Station } from "@/lib/domain";
import { figure } from "./units";
import type { LastEntry } from "@/hooks/use-entry-store";
import type { StationView } from "@/lib/offline/route-status";

export interface CorrectionCase {
  view: StationView;
  /** The kept reading the new one would supersede (the live query's or one just saved). */
  keptId?: string;
  /** The last entry made on this tablet, which may be ahead of the live query. */
  last?: LastEntry;
  /** The machinist tapped "Measure again" for this station. */
  measuringAgain: boolean;
}

/** Whether saving here records a correction the machinist has not asked for. */
export function asksBeforeCorrecting({ view, keptId, last, measuringAgain }: CorrectionCase): boolean {
  if (!keptId || measuringAgain) return false;
  // The bench itself asked for this one: the confirming reading after an out-of-spec figure.
  if (last?.stationId === view.station.id && last.stayed) return false;
  const liveQueryCaughtUp = view.current?.id === keptId;
  return !liveQueryCaughtUp || !["confirm", "revisit"].includes(view.state);
}

function keptInWords(view: StationView, keptId: string, last?: LastEntry): string {
  const kept = view.current?.id === keptId ? view.current : undefined;
  const skipped = kept ? kept.skipped : last?.skipped;
  if (skipped) return "was skipped";
  const value = kept ? kept.value : last?.stationId === view.station.id ? last.value : null;
  if (value === null || value === undefined) return "already has a reading";
  const verdict = view.current?.id === keptId && view.verdict ? ` (${VERDICT_WORDS[view.verdict].toLowerCase()})` : "";
  return `already has ${figure(value, view.station.unit)} ${UNIT_WORDS[view.station.unit]}${verdict}`;
}

/** The question, in words: what is kept, what would replace it, and how to go on. */
export function correctionQuestion(c: CorrectionCase, station: Station, newValue: number): string {
  const now = `${figure(newValue, station.unit)} ${UNIT_WORDS[station.unit]}`;
  return (
    `${station.label} ${keptInWords(c.view, c.keptId!, c.last)}. Save again to record ${now} as a correction ` +
    "that replaces it, or Clear to keep it."
  );
}
