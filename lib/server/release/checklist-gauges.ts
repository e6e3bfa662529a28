import "server-only";
import {
  convertMeasure,
  gaugeRangeWords,
  gaugeSuits,
  instrumentKindWords,
  parseStationId,
  rangeHolds,
  stationWords,
  studyProblem,
  type GaugeStudySummary,
  type RawCharacteristic,
  type StudyProblem,
} from "@/lib/domain";
import type { ChecklistCheck, ChecklistItem } from "@/lib/schemas/release";
import { benchLink, plural } from "@/lib/server/release/checklist-rules";
import type { InstrumentRow, JobRecord } from "@/lib/server/release/repo";
import type { StoredReading } from "@/lib/schemas/readings";

// The gauges check of the release checklist: every current reading (a skip needs none) names a
// gauge of this shop, of a kind that measures its station, whose range holds the value (the core's
// rule, lib/domain/gauge-range.ts, as the tablet and the upload ask it), that was in calibration
// on the day and whose latest study, if it has one, stood behind it (the core's studyProblem: not past
// its due date on the day, capable for the reading's tolerance). Pure, like the other checks.

/** The UTC calendar day of a time; a gauge is in calibration through its due date. */
const dayOf = (t: Date | string) => new Date(t).toISOString().slice(0, 10);
const num = (x: unknown) => (x === null || x === undefined ? null : Number(x));

type Problem = { key: string; text: string };

/** The reading's tolerance T (upper − lower limit as judged) in the gauge's unit; null for a one-sided limit. */
function toleranceOf(r: StoredReading, gaugeUnit: string): number | null {
  if (r.limitMin === null || r.limitMax === null) return null;
  const t = convertMeasure(Number(r.limitMax) - Number(r.limitMin), r.unit, gaugeUnit);
  return t === undefined ? null : t;
}

/** Whether the gauge's latest study stood behind this reading (the checklist and the build record ask). */
export function readingStudyProblem(
  r: StoredReading,
  inst: InstrumentRow,
  study: GaugeStudySummary | undefined,
): StudyProblem | null {
  return studyProblem(study, {
    resolution: Number(inst.resolution),
    tolerance: toleranceOf(r, inst.unit),
    takenOn: dayOf(r.takenAt),
    unit: inst.unit,
  });
}

function studyProblemOf(r: StoredReading, inst: InstrumentRow, study: GaugeStudySummary | undefined): Problem | null {
  const problem = readingStudyProblem(r, inst, study);
  if (!problem) return null;
  return { key: `study-${problem.kind}:${inst.id}`, text: `${inst.label} (serial ${inst.serial}) ${problem.words}` };
}

function problemOf(
  r: StoredReading,
  inst: InstrumentRow | undefined,
  study: GaugeStudySummary | undefined,
): Problem | null {
  if (r.instrumentId === null || r.instrumentId === undefined) return { key: "none", text: "No gauge is recorded" };
  if (!inst) return { key: `${r.instrumentId}`, text: `Gauge #${r.instrumentId} is not in this shop's gauge list` };
  const name = `${inst.label} (serial ${inst.serial})`;
  const facts = { kind: inst.kind, unit: inst.unit, rangeMin: num(inst.rangeMin), rangeMax: num(inst.rangeMax) };
  const c = parseStationId(r.stationId).characteristic as RawCharacteristic;
  if (!gaugeSuits(facts, c)) {
    const kind = instrumentKindWords(inst.kind).toLowerCase();
    const a = /^[aeiou]/.test(kind) ? "an" : "a";
    return { key: `kind:${inst.id}`, text: `${name} is ${a} ${kind}, which cannot measure these stations` };
  }
  if (r.value !== null && !rangeHolds(facts, r.value, r.unit))
    return { key: `range:${inst.id}`, text: `${name} reads ${gaugeRangeWords(facts)}; values outside that range` };
  if (!inst.calibrationDue) return { key: `${inst.id}`, text: `${name} has no calibration due date on file` };
  if (dayOf(r.takenAt) > inst.calibrationDue)
    return { key: `${inst.id}`, text: `${name} was past its calibration due date (${inst.calibrationDue})` };
  return studyProblemOf(r, inst, study);
}

const FIX: Record<string, string> = {
  none: "Measure again and name the gauge, or add the gauge on a correction",
  kind: "Measure again with a gauge of a kind that measures them",
  range: "Measure again with a gauge whose range holds the value",
  calibration: "Measure again with a gauge in calibration, or correct the gauge's dates if they are wrong",
  "study-overdue": "Measure again with a gauge whose study is current, or study this gauge again first",
  "study-failed": "Measure again with a gauge capable for this tolerance (its study passes for it)",
};

/** A study's item leads to the gauge's own page (its studies); the others to the gauge list. */
function gaugeLink(key: string): { label: string; href: string } {
  const [kind, id] = key.split(":");
  return kind.startsWith("study-") ? { label: "Gauge and its studies", href: `/admin/gauges/${id}` } : GAUGES;
}
const GAUGES = { label: "Gauges", href: "/admin/gauges" };

export function gaugesCheck(record: JobRecord, current: Map<string, StoredReading>): ChecklistCheck {
  const title = "Every reading has a suitable gauge in calibration, its study standing";
  const instruments = new Map(record.instruments.map((i) => [i.id, i]));
  const groups = new Map<string, { text: string; readings: StoredReading[] }>();
  const used = new Set<number>();
  let total = 0;
  for (const r of current.values()) {
    if (r.skipped) continue;
    total += 1;
    if (r.instrumentId !== null && r.instrumentId !== undefined) used.add(r.instrumentId);
    const p = problemOf(r, instruments.get(r.instrumentId ?? -1), record.studies.get(r.instrumentId ?? -1));
    if (!p) continue;
    const g = groups.get(p.key) ?? { text: p.text, readings: [] };
    g.readings.push(r);
    groups.set(p.key, g);
  }
  const items: ChecklistItem[] = [...groups.entries()].map(([key, { text, readings }]) => {
    const where = readings
      .slice(0, 3)
      .map((r) => stationWords(r.stationId))
      .join("; ");
    const more = readings.length > 3 ? ` and ${readings.length - 3} more` : "";
    const fix = FIX[key.split(":")[0]] ?? FIX.calibration;
    return {
      check: "gauges",
      key: `gauges:${key}`,
      text: `${text} on ${plural(readings.length, "current reading")}: ${where}${more}. ${fix}`,
      links: [gaugeLink(key), benchLink(record.job.id, readings[0].stationId)],
    };
  });
  const bad = [...groups.values()].reduce((n, g) => n + g.readings.length, 0);
  const summary =
    total === 0
      ? "No current readings yet"
      : bad === 0
        ? `All ${plural(total, "reading")} have a suitable gauge in calibration (${plural(used.size, "gauge")} used)`
        : `${total - bad} of ${plural(total, "reading")} have a suitable gauge in calibration; ${bad} do not`;
  return { id: "gauges", title, ok: items.length === 0, summary, items };
}
