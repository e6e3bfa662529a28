import "server-only";
import {
  convertLength,
  convertTorque,
  uncertaintyAtK2,
  type Evaluation,
  type Lubricant,
  type MeasureUnit,
  type RawReading,
} from "@/lib/domain";
import type { BenchInstrument, ReadingEvaluation } from "@/lib/schemas/sync";

// The edge between a stored (or incoming) reading and the core's RawReading, shared by ingest and
// flag reconciliation so a verdict computed at upload and one recomputed after a limits edit can
// never disagree. No formula lives here: conversions and verdicts come from lib/domain.

/** A gauge as the server checks readings against it: the tablet's view plus its shop. */
export type InstrumentInfo = BenchInstrument & { shopId: number };

/** What the core needs of a reading, whether it came from the tablet or from the database. */
export type ReadingFacts = {
  id: string;
  stationId: string;
  value: number | null;
  unit: string;
  partTempC: number | null;
  gaugeTempC: number | null;
  lubricant: string | null;
  instrumentId: number | null;
  takenAt: Date;
};

const isLength = (u: string): u is "in" | "mm" => u === "in" || u === "mm";
const isTorque = (u: string): u is "lbf_ft" | "nm" => u === "lbf_ft" || u === "nm";

/** The stored columns are DECIMAL(14,6): round the same way so a recomputation compares equal. */
export const round6 = (x: number | null | undefined): number | null =>
  x === null || x === undefined || !Number.isFinite(x) ? null : Number(x.toFixed(6)) || 0;

/** x in `from` expressed in `to`, or undefined when one is a length and the other a torque. */
export function convertUnit(x: number, from: string, to: string): number | undefined {
  if (from === to) return x;
  if (isLength(from) && isLength(to)) return convertLength(x, from, to);
  if (isTorque(from) && isTorque(to)) return convertTorque(x, from, to);
  return undefined;
}

/** mm for lengths, N·m for torque (the readings.value_canonical column). */
export function canonicalValue(value: number, unit: string): number | null {
  return round6(isLength(unit) ? convertUnit(value, unit, "mm") : convertUnit(value, unit, "nm"));
}

/** The gauge's expanded uncertainty at k = 2, in `unit`; undefined when the units do not mix. */
export function uncertaintyIn(inst: InstrumentInfo | undefined, unit: string): number | undefined {
  if (!inst || !(inst.expandedU >= 0)) return undefined;
  const atK2 = uncertaintyAtK2(inst.expandedU, inst.coverageK > 0 ? inst.coverageK : 2);
  return convertUnit(atK2, inst.unit, unit);
}

/** Past due when the reading's date (UTC) is after the gauge's calibration due date. */
export function gaugePastDue(inst: InstrumentInfo | undefined, takenAt: Date): boolean {
  return !!inst?.calibrationDue && takenAt.toISOString().slice(0, 10) > inst.calibrationDue;
}

export function toRaw(r: ReadingFacts, inst?: InstrumentInfo): RawReading {
  const u = uncertaintyIn(inst, r.unit);
  return {
    stationId: r.stationId,
    value: r.value as number,
    unit: r.unit as MeasureUnit,
    takenAt: r.takenAt.toISOString(),
    ...(r.partTempC !== null ? { temperatureC: r.partTempC } : {}),
    ...(r.gaugeTempC !== null ? { gaugeTemperatureC: r.gaugeTempC } : {}),
    ...(u !== undefined ? { uncertainty: u } : {}),
    ...(r.lubricant ? { lubricant: r.lubricant as Lubricant } : {}),
  };
}

/** The core's Evaluation as the readings table stores it: limits and deviation in the unit entered. */
export function storedEvaluation(ev: Evaluation | null, unitEntered: string, pastDue: boolean): ReadingEvaluation {
  const from = ev?.limits?.unit ?? ev?.unit ?? unitEntered;
  const conv = (x: number | undefined) => (x === undefined ? null : round6(convertUnit(x, from, unitEntered)));
  return {
    verdict: ev?.verdict ?? null,
    verdictNote: pastDue ? "gauge_past_due" : null,
    unit: unitEntered,
    limitMin: conv(ev?.limits?.min),
    limitMax: conv(ev?.limits?.max),
    deviation: conv(ev?.deviation),
  };
}

export function sameEvaluation(a: Omit<ReadingEvaluation, "unit">, b: Omit<ReadingEvaluation, "unit">): boolean {
  return (
    a.verdict === b.verdict &&
    a.verdictNote === b.verdictNote &&
    round6(a.limitMin) === round6(b.limitMin) &&
    round6(a.limitMax) === round6(b.limitMax) &&
    round6(a.deviation) === round6(b.deviation)
  );
}
