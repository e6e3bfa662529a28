import "server-only";
import {
  benchRoute,
  currentReadings,
  deriveReadings,
  LUBRICANT_LABELS,
  SECTION_LABELS,
  type DerivedValue,
  type Lubricant,
  type Verdict,
  type RawReading,
  type SectionId,
  characteristicWords,
  stationWords,
  VERDICT_WORDS,
} from "@/lib/domain";
import { instrumentInfo, toRaw } from "@/lib/server/sync/ingest-evaluate";
import type { InstrumentRow, JobRecord } from "@/lib/server/release/repo";
import type { StoredReading } from "@/lib/schemas/readings";
import { limitsText, num, signed, stamp, withUnit } from "@/lib/server/record/format";
import type { DerivedLine, ReadingLine, ReadingSection, Tally, TorqueLine } from "@/lib/schemas/record";

// The measured part of the record: each current reading by bench section (torque apart, with its
// lubricant), and every derived value the core computes from them. Verdicts, limits and
// deviations of readings are the server's stored ones (what the flags were raised from).

export type Lookups = { names: Map<number, string>; photosByReading: Map<string, string[]> };

/** The gauge's serial; the gauges table of the record gives its name, uncertainty and calibration. */
function gaugeWords(r: StoredReading, gauges: Map<number, InstrumentRow>): string {
  const g = r.instrumentId ? gauges.get(r.instrumentId) : undefined;
  return g ? g.serial : "";
}

function verdictWords(r: StoredReading): string {
  if (r.skipped) return "Skipped";
  return r.verdict ? VERDICT_WORDS[r.verdict as Verdict] : "No limit";
}

function readingNotes(r: StoredReading): string {
  const notes: string[] = [];
  if (r.skipped) notes.push(r.skipReason ? `skipped: ${r.skipReason}` : "skipped");
  if (r.entryMode === "dial" && r.dialSetting !== null)
    notes.push(`dial gauge set at ${num(r.dialSetting, r.unit)}, read ${signed(r.dialDeviation, r.unit) || "0"}`);
  if (r.partTempC !== null && r.partTempC !== undefined) notes.push(`part at ${r.partTempC} °C`);
  if (r.verdictNote === "gauge_past_due") notes.push("gauge was past its calibration due date");
  if (r.supersedes) notes.push("corrects an earlier reading");
  if (r.note) notes.push(r.note);
  return notes.join("; ");
}

function readingLine(r: StoredReading, gauges: Map<number, InstrumentRow>, look: Lookups): ReadingLine {
  return {
    stationId: r.stationId,
    station: stationWords(r.stationId),
    value: r.skipped ? "" : withUnit(r.value, r.unit),
    limits: r.limitMin !== null || r.limitMax !== null ? limitsText(r.limitMin, r.limitMax, r.unit) : "no limit",
    deviation: signed(r.deviation, r.unit),
    verdict: r.skipped ? null : ((r.verdict as Verdict | null) ?? null),
    verdictWords: verdictWords(r),
    gauge: gaugeWords(r, gauges),
    takenBy: look.names.get(r.takenBy) ?? "",
    takenAt: stamp(r.takenAt),
    notes: readingNotes(r),
    photos: look.photosByReading.get(r.id) ?? [],
  };
}

/** Section order of the engine's route; readings at stations the route lacks go last. */
function stationOrder(record: JobRecord): Map<string, { index: number; section: SectionId }> {
  try {
    const stations = benchRoute(record.shape).sections.flatMap((s) =>
      s.stations.map((st) => ({ id: st.id, section: s.id })),
    );
    return new Map(stations.map((s, index) => [s.id, { index, section: s.section }]));
  } catch {
    return new Map();
  }
}

export function readingSections(
  record: JobRecord,
  look: Lookups,
): { sections: ReadingSection[]; torque: TorqueLine[]; current: StoredReading[] } {
  const gauges = new Map(record.instruments.map((g) => [g.id, g]));
  const order = stationOrder(record);
  const current = [...currentReadings(record.readings).values()].sort(
    (a, b) =>
      (order.get(a.stationId)?.index ?? 1e9) - (order.get(b.stationId)?.index ?? 1e9) ||
      a.stationId.localeCompare(b.stationId),
  );
  const sections = new Map<string, ReadingSection>();
  const torque: TorqueLine[] = [];
  for (const r of current) {
    if (r.characteristic === "fastener_torque") {
      torque.push(torqueLine(r, gauges, look));
      continue;
    }
    const id = order.get(r.stationId)?.section ?? r.stationId.split("/")[0];
    const label = (SECTION_LABELS as Record<string, string>)[id] ?? "Other readings";
    const section = sections.get(id) ?? { id, label, what: characteristicWords(r.characteristic), rows: [] };
    section.rows.push(readingLine(r, gauges, look));
    sections.set(id, section);
  }
  return { sections: [...sections.values()], torque, current };
}

function torqueLine(r: StoredReading, gauges: Map<number, InstrumentRow>, look: Lookups): TorqueLine {
  const lube = r.lubricant ? (LUBRICANT_LABELS[r.lubricant as Lubricant] ?? r.lubricant) : "not recorded";
  return {
    station: stationWords(r.stationId),
    value: r.skipped ? "skipped" : withUnit(r.value, r.unit),
    limits: r.limitMin !== null || r.limitMax !== null ? limitsText(r.limitMin, r.limitMax, r.unit) : "no limit",
    verdict: r.skipped ? null : (r.verdict ?? null),
    verdictWords: verdictWords(r),
    lubricant: lube,
    gauge: gaugeWords(r, gauges),
    takenBy: look.names.get(r.takenBy) ?? "",
    takenAt: stamp(r.takenAt),
  };
}

function derivedLine(d: DerivedValue): DerivedLine {
  const unit = d.limits?.unit ?? d.unit;
  const from =
    d.inputs.length <= 2
      ? d.inputs.map(stationWords).join(" and ")
      : `${d.inputs.length} readings at ${stationWords(d.stationId)}`;
  return {
    key: d.key,
    what: characteristicWords(d.characteristic),
    station: stationWords(d.stationId),
    value: withUnit(d.value, unit),
    limits: d.limits ? limitsText(d.limits.min, d.limits.max, d.limits.unit) : "no limit",
    deviation: signed(d.deviation, unit),
    verdict: d.verdict ?? null,
    verdictWords: d.verdict ? VERDICT_WORDS[d.verdict] : "No limit",
    from: `from ${from}`,
  };
}

/** Derived values that have a value (those still missing inputs are left out). */
export function derivedLines(record: JobRecord, current: StoredReading[]): DerivedLine[] {
  const infos = new Map(record.instruments.map((g) => [g.id, instrumentInfo(g)]));
  const raw: RawReading[] = current
    .filter((r) => !r.skipped && r.value !== null)
    .map((r) => toRaw(r, r.instrumentId ? infos.get(r.instrumentId) : undefined));
  try {
    return deriveReadings(raw, record.shape, record.spec)
      .filter((d) => typeof d.value === "number")
      .map(derivedLine);
  } catch {
    return []; // an engine the core cannot lay out has no derived values; the readings still print
  }
}

export function tallyOf(current: StoredReading[]): Tally {
  const t: Tally = { measured: 0, inSpec: 0, marginal: 0, outOfSpec: 0, skipped: 0, unjudged: 0 };
  for (const r of current) {
    if (r.skipped) {
      t.skipped += 1;
      continue;
    }
    t.measured += 1;
    if (r.verdict === "in_spec") t.inSpec += 1;
    else if (r.verdict === "marginal") t.marginal += 1;
    else if (r.verdict === "out_of_spec") t.outOfSpec += 1;
    else t.unjudged += 1;
  }
  return t;
}
