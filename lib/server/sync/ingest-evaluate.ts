import "server-only";
import {
  convertMeasure,
  coreReading,
  gaugeStudyConcern,
  quantityOfUnit,
  type Evaluation,
  type RawReading,
} from "@/lib/domain";
import type { StoredReading } from "@/lib/schemas/readings";
import type { BenchInstrument, ReadingEvaluation } from "@/lib/schemas/sync";

// The edge between a stored (or incoming) reading and the core's RawReading, shared by ingest and
// flag reconciliation so a verdict computed at upload and one recomputed after a limits edit can
// never disagree. No formula lives here: conversions and verdicts come from lib/domain.

/** A gauge as the server checks readings against it: the tablet's view plus its shop. */
export type InstrumentInfo = BenchInstrument & { shopId: number };

/** A gauge row as stored (DECIMAL columns may come back as text, flags as 0/1). */
type StoredInstrument = Pick<InstrumentInfo, "id" | "shopId" | "kind" | "label" | "serial" | "unit"> & {
  resolution: unknown;
  expandedU: unknown;
  coverageK?: unknown;
  rangeMin?: unknown;
  rangeMax?: unknown;
  calibrationDue?: string | null;
  dialPlusMeansSmaller?: unknown;
  active?: unknown;
  study?: BenchInstrument["study"];
};

/** A DECIMAL column that may be empty, as a number or null. */
export const orNull = (x: unknown): number | null => (x === null || x === undefined ? null : Number(x));

/** The one conversion of a stored gauge into what the evaluation needs (k = 2 when none was given). */
export function instrumentInfo(i: StoredInstrument): InstrumentInfo {
  return {
    id: i.id,
    shopId: i.shopId,
    kind: i.kind,
    label: i.label,
    serial: i.serial,
    unit: i.unit,
    resolution: Number(i.resolution),
    expandedU: Number(i.expandedU),
    coverageK: Number(i.coverageK ?? 2),
    rangeMin: orNull(i.rangeMin),
    rangeMax: orNull(i.rangeMax),
    calibrationDue: i.calibrationDue ?? null,
    dialPlusMeansSmaller: !!i.dialPlusMeansSmaller,
    active: !!i.active,
    study: i.study ?? null,
  };
}

/** What the core needs of a reading, whether it came from the tablet or from the database. */
export type ReadingFacts = Pick<
  StoredReading,
  "id" | "stationId" | "value" | "unit" | "partTempC" | "gaugeTempC" | "lubricant" | "instrumentId" | "takenAt"
>;

/** The stored columns are DECIMAL(14,6): round the same way so a recomputation compares equal. */
export const round6 = (x: number | null | undefined): number | null =>
  x === null || x === undefined || !Number.isFinite(x) ? null : Number(x.toFixed(6)) || 0;

/** mm for lengths, N·m for torque (the readings.value_canonical column). */
export function canonicalValue(value: number, unit: string): number | null {
  return round6(convertMeasure(value, unit, quantityOfUnit(unit) === "length" ? "mm" : "nm"));
}

/** Past due when the reading's date (UTC) is after the gauge's calibration due date. */
export function gaugePastDue(inst: InstrumentInfo | undefined, takenAt: Date): boolean {
  return !!inst?.calibrationDue && takenAt.toISOString().slice(0, 10) > inst.calibrationDue;
}

/** The core's input for a stored reading (current readings always carry a value); the rule is the core's. */
export const toRaw = (r: ReadingFacts, inst?: InstrumentInfo): RawReading =>
  // Passed as it is (copying a stored row's every field cost more than the step): coreReading reads
  // the facts it needs, and a current reading's value is a number.
  coreReading(r as ReadingFacts & { value: number }, inst);

/** The limits' width T (upper − lower) in the gauge's unit; undefined for a one-sided limit. */
function toleranceIn(ev: Evaluation | null, unit: string): number | undefined {
  const l = ev?.limits;
  if (!l || typeof l.min !== "number" || typeof l.max !== "number") return undefined;
  return convertMeasure(l.max - l.min, l.unit ?? ev.unit, unit);
}

/** What is said about the gauge: past its calibration due date first, then its latest study. */
function gaugeNote(ev: Evaluation | null, pastDue: boolean, gauge?: { inst?: InstrumentInfo; takenAt: Date }) {
  if (pastDue) return "gauge_past_due";
  const inst = gauge?.inst;
  if (!gauge || !inst?.study || !ev) return null;
  const takenOn = gauge.takenAt.toISOString().slice(0, 10);
  return gaugeStudyConcern(inst.study, inst.resolution, toleranceIn(ev, inst.unit), takenOn);
}

/**
 * The core's Evaluation as the readings table stores it: limits and deviation in the unit entered,
 * and the note about the gauge (`gauge` names it and when the reading was taken).
 */
export function storedEvaluation(
  ev: Evaluation | null,
  unitEntered: string,
  pastDue: boolean,
  gauge?: { inst?: InstrumentInfo; takenAt: Date },
): ReadingEvaluation {
  const from = ev?.limits?.unit ?? ev?.unit ?? unitEntered;
  const conv = (x: number | undefined) => (x === undefined ? null : round6(convertMeasure(x, from, unitEntered)));
  return {
    verdict: ev?.verdict ?? null,
    verdictNote: gaugeNote(ev, pastDue, gauge),
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
