import "server-only";
import {
  cleanDecimal,
  convertLength,
  convertTorque,
  characteristicWords,
  deriveReadings,
  LUBRICANT_LABELS,
  roundToResolution,
  stationWords,
  UNIT_WORDS,
  VERDICT_WORDS,
  type LengthUnit,
  type Lubricant,
  type MeasureUnit,
  type RawReading,
  type TorqueUnit,
} from "@/lib/domain";
import type { Disposition } from "@/lib/schemas/enums";
import { DISPOSITION_WORDS } from "@/lib/schemas/flag";
import type { FlagDecisionRow } from "@/lib/server/flags/repo";
import type { StoredReading } from "@/lib/schemas/readings";
import type { InstrumentInfo } from "@/lib/server/sync/ingest-evaluate";
import type { JobContext } from "@/lib/server/jobs/context";
import type { Cell } from "@/lib/server/readings/csv-export";

// The rows of GET /api/jobs/[jobId]/readings.csv (written by csv-export-stream.ts): one row per
// current reading (each station's current reading by the core's rule, a skip included) and per
// derived value that has a value, in bench order. With history, every other reading is listed
// before the current one of its station and marked superseded? "yes" (corrected, measured again,
// or a skip). Values, limits and deviations
// are in the job's units (the header says which: lengths in in or mm, torque in lbf·ft or N·m)
// and the unit column names the row's own unit.
// Verdicts, limits and deviations of readings are the server's stored ones; limits are written to
// the unit's display resolution (the core's roundToResolution), so a limit computed from a size
// (ring gap per inch of bore) reads 0.0018, not 0.001836765. The format is documented in csv-export.ts.

export type Units = { length: LengthUnit; torque: TorqueUnit };

const isTorqueUnit = (u: MeasureUnit) => u === "lbf_ft" || u === "nm";

export const unitsOf = (unitSystem: string): Units =>
  unitSystem === "mm" ? { length: "mm", torque: "nm" } : { length: "in", torque: "lbf_ft" };

function converter(units: Units) {
  return (x: number | null | undefined, from: MeasureUnit): number | null => {
    if (x === null || x === undefined) return null;
    // Converted figures are cleaned of float noise (102.362 mm is 4.03 in, not 4.029999999999999).
    if (from === "in" || from === "mm")
      return from === units.length ? x : cleanDecimal(convertLength(x, from, units.length));
    return from === units.torque ? x : cleanDecimal(convertTorque(x, from, units.torque));
  };
}

/** A limit in the job's unit, rounded to that unit's display resolution. */
function limitOf(units: Units) {
  const to = converter(units);
  return (x: number | null | undefined, from: MeasureUnit): number | null => {
    const v = to(x, from);
    return v === null ? null : roundToResolution(v, isTorqueUnit(from) ? units.torque : units.length);
  };
}

// Each pair of units' converters, made once (an export writes hundreds of rows in one pair).
const CONVERTERS = new Map<string, { to: ReturnType<typeof converter>; limit: ReturnType<typeof limitOf> }>();
function convertersOf(units: Units) {
  const key = `${units.length} ${units.torque}`;
  let made = CONVERTERS.get(key);
  if (!made) CONVERTERS.set(key, (made = { to: converter(units), limit: limitOf(units) }));
  return made;
}

/** The latest decision on a flag in words: "Machine again (hone)", or where the flag stands without one. */
function decisionWords(f: FlagDecisionRow | undefined): string {
  if (!f) return "";
  if (f.disposition)
    return `${DISPOSITION_WORDS[f.disposition as Disposition]}${f.operation ? ` (${f.operation})` : ""}`;
  return f.state === "closed" ? "Flag closed, no decision" : "Flagged, no decision yet";
}

/** Each reading's or computed value's latest flag (flags come oldest first, so the latest wins). */
export function decisionsBy(flags: FlagDecisionRow[], key: "readingId" | "derivedKey"): Map<string, FlagDecisionRow> {
  const out = new Map<string, FlagDecisionRow>();
  for (const f of flags) if (f[key]) out.set(f[key]!, f);
  return out;
}

export type RowContext = {
  current: Set<string>;
  instruments: Map<number, InstrumentInfo>;
  takers: Map<number, string>;
  decisions: Map<string, FlagDecisionRow>;
};

export function readingRow(r: StoredReading, units: Units, ctx: RowContext): Cell[] {
  const { to, limit } = convertersOf(units);
  const unit = r.unit as MeasureUnit;
  const rowUnit = isTorqueUnit(unit) ? units.torque : units.length;
  const gauge = r.instrumentId ? ctx.instruments.get(r.instrumentId)?.serial : null;
  return [
    "reading",
    r.stationId,
    stationWords(r.stationId),
    characteristicWords(r.characteristic),
    r.skipped ? null : to(r.value, unit),
    UNIT_WORDS[rowUnit],
    limit(r.limitMin, unit),
    limit(r.limitMax, unit),
    r.skipped ? "Skipped" : r.verdict ? VERDICT_WORDS[r.verdict] : "",
    to(r.deviation, unit),
    gauge,
    ctx.takers.get(r.takenBy) ?? "",
    r.takenAt.toISOString(),
    ctx.current.has(r.id) ? "no" : "yes",
    r.lubricant ? (LUBRICANT_LABELS[r.lubricant as Lubricant] ?? r.lubricant) : "",
    r.skipped ? (r.skipReason ?? "") : "",
    decisionWords(ctx.decisions.get(r.id)),
  ];
}

/** Rows of the computed values that have a value (none when the engine cannot be laid out). */
export function derivedRows(
  job: Pick<JobContext, "shape" | "spec">,
  raws: RawReading[],
  units: Units,
  decisions: Map<string, FlagDecisionRow>,
): Cell[][] {
  const { to, limit } = convertersOf(units);
  try {
    return deriveReadings(raws, job.shape, job.spec)
      .filter((d) => typeof d.value === "number")
      .map((d) => [
        "derived",
        d.stationId,
        stationWords(d.stationId),
        characteristicWords(d.characteristic),
        to(d.value, d.unit),
        UNIT_WORDS[units.length],
        d.limits ? limit(d.limits.min, d.limits.unit) : null,
        d.limits ? limit(d.limits.max, d.limits.unit) : null,
        d.verdict ? VERDICT_WORDS[d.verdict] : "",
        to(d.deviation, d.unit),
        "",
        "",
        "",
        "",
        "",
        "",
        decisionWords(decisions.get(d.key)),
      ]);
  } catch {
    return []; // An engine the core cannot lay out: readings still export.
  }
}

export function csvHeader(units: Units): string[] {
  const u = `${UNIT_WORDS[units.length]} | ${UNIT_WORDS[units.torque]}`;
  return [
    "row",
    "station",
    "station (words)",
    "characteristic",
    `value (${u})`,
    "unit",
    `min (${u})`,
    `max (${u})`,
    "verdict",
    `deviation (${u})`,
    "gauge serial",
    "taken by",
    "taken at (UTC, ISO 8601)",
    "superseded?",
    "lubricant",
    "skip reason",
    "decision",
  ];
}
