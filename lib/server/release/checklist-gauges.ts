import "server-only";
import {
  gaugeRangeWords,
  gaugeSuits,
  instrumentKindWords,
  parseStationId,
  rangeHolds,
  stationWords,
  type RawCharacteristic,
} from "@/lib/domain";
import type { ChecklistCheck, ChecklistItem } from "@/lib/schemas/release";
import { benchLink, plural } from "@/lib/server/release/checklist-rules";
import type { InstrumentRow, JobRecord } from "@/lib/server/release/repo";
import type { StoredReading } from "@/lib/schemas/readings";

// The gauges check of the release checklist: every current reading (a skip needs none) names a
// gauge of this shop, of a kind that measures its station, whose range holds the value (the core's
// rule, lib/domain/gauge-range.ts, as the tablet and the upload ask it) and that was in calibration
// on the day. Pure, like the other checks.

/** The UTC calendar day of a time; a gauge is in calibration through its due date. */
const dayOf = (t: Date | string) => new Date(t).toISOString().slice(0, 10);
const num = (x: unknown) => (x === null || x === undefined ? null : Number(x));

type Problem = { key: string; text: string };

function problemOf(r: StoredReading, inst: InstrumentRow | undefined): Problem | null {
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
  return null;
}

const FIX: Record<string, string> = {
  none: "Measure again and name the gauge, or add the gauge on a correction",
  kind: "Measure again with a gauge of a kind that measures them",
  range: "Measure again with a gauge whose range holds the value",
  calibration: "Measure again with a gauge in calibration, or correct the gauge's dates if they are wrong",
};

export function gaugesCheck(record: JobRecord, current: Map<string, StoredReading>): ChecklistCheck {
  const title = "Every reading has a suitable gauge in calibration";
  const instruments = new Map(record.instruments.map((i) => [i.id, i]));
  const groups = new Map<string, { text: string; readings: StoredReading[] }>();
  const used = new Set<number>();
  let total = 0;
  for (const r of current.values()) {
    if (r.skipped) continue;
    total += 1;
    if (r.instrumentId !== null && r.instrumentId !== undefined) used.add(r.instrumentId);
    const p = problemOf(r, instruments.get(r.instrumentId ?? -1));
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
      links: [{ label: "Gauges", href: "/admin/gauges" }, benchLink(record.job.id, readings[0].stationId)],
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
