import "server-only";
import { decimalString as dec, isoUtc, type CanonicalValue, type ReleaseSnapshot } from "@/lib/server/release/hash";
import type { DispositionRow, FlagRow, InstrumentRow, JobRecord, LimitRow } from "@/lib/server/release/repo";
import type { StoredReading } from "@/lib/schemas/readings";

// From database rows to the records of the canonical release document (rules in hash.ts).
// Each function lists every field of its record; DECIMALs carry their column's scale from the
// migrations (readings/flags/limits DECIMAL(14,6), part_temp_c and gauge_temp_c (6,2),
// instruments (12,6), k (4,2)).
// Left out on purpose: created_at/updated_at/received_at (bookkeeping, not what was measured)
// and a job's title and notes (wording the office may tidy after release).

type Rec = { [key: string]: CanonicalValue };

export function readingRecord(r: StoredReading): Rec & { id: string } {
  return {
    id: r.id,
    stationId: r.stationId,
    characteristic: r.characteristic,
    valueCanonical: dec(r.valueCanonical, 6),
    valueEntered: dec(r.value, 6),
    unitEntered: r.unit,
    entryMode: r.entryMode,
    dialSetting: dec(r.dialSetting, 6),
    dialDeviation: dec(r.dialDeviation, 6),
    instrumentId: r.instrumentId ?? null,
    partTempC: dec(r.partTempC, 2),
    gaugeTempC: dec(r.gaugeTempC, 2),
    lubricant: r.lubricant ?? null,
    skipped: Boolean(r.skipped),
    skipReason: r.skipReason ?? null,
    note: r.note ?? null,
    takenBy: r.takenBy,
    takenAt: isoUtc(r.takenAt),
    deviceId: r.deviceId,
    supersedes: r.supersedes ?? null,
    verdict: r.verdict ?? null,
    verdictNote: r.verdictNote ?? null,
    limitMin: dec(r.limitMin, 6),
    limitMax: dec(r.limitMax, 6),
    deviation: dec(r.deviation, 6),
  };
}

export function limitRecord(l: LimitRow): Rec & { id: number } {
  return {
    id: l.id,
    characteristic: l.characteristic,
    stationPattern: l.stationPattern,
    limitType: l.limitType,
    unit: l.unit,
    min: dec(l.min, 6),
    max: dec(l.max, 6),
    nominal: dec(l.nominal, 6),
    tolPlus: dec(l.tolPlus, 6),
    tolMinus: dec(l.tolMinus, 6),
    perInchMin: dec(l.perInchMin, 6),
    perInchMax: dec(l.perInchMax, 6),
    isoClass: l.isoClass ?? null,
    required: Boolean(l.required),
    gaugeKind: l.gaugeKind ?? null,
    label: l.label ?? null,
    sortOrder: l.sortOrder,
  };
}

export function flagRecord(f: FlagRow): Rec & { id: number } {
  return {
    id: f.id,
    readingId: f.readingId ?? null,
    derivedKey: f.derivedKey ?? null,
    stationId: f.stationId,
    characteristic: f.characteristic,
    value: dec(f.value, 6),
    unit: f.unit,
    limitMin: dec(f.limitMin, 6),
    limitMax: dec(f.limitMax, 6),
    deviation: dec(f.deviation, 6),
    verdict: f.verdict,
    reason: f.reason,
    state: f.state,
    disposition: f.disposition ?? null,
    operation: f.operation ?? null,
    dispositionReason: f.dispositionReason ?? null,
    disposedBy: f.disposedBy ?? null,
    disposedAt: isoUtc(f.disposedAt),
    closedAt: isoUtc(f.closedAt),
    closedByReadingId: f.closedByReadingId ?? null,
  };
}

export function dispositionRecord(d: DispositionRow): Rec & { id: number } {
  return {
    id: d.id,
    flagId: d.flagId,
    disposition: d.disposition,
    operation: d.operation ?? null,
    reason: d.reason ?? null,
    userId: d.userId,
    createdAt: isoUtc(d.createdAt),
  };
}

/** A gauge as it stood at signing; stored in the release row and hashed from there. */
export function gaugeRecord(i: InstrumentRow): Rec & { id: number } {
  return {
    id: i.id,
    kind: i.kind,
    label: i.label,
    serial: i.serial,
    unit: i.unit,
    resolution: dec(i.resolution, 6),
    expandedU: dec(i.expandedU, 6),
    coverageK: dec(i.coverageK, 2),
    calibratedOn: i.calibratedOn ?? null,
    calibrationDue: i.calibrationDue ?? null,
  };
}

export function jobRecord(record: JobRecord): Rec & { id: number } {
  const j = record.job;
  return {
    id: j.id,
    shopId: j.shopId,
    code: j.code,
    customerId: j.customerId,
    engineId: j.engineId,
    unitSystem: j.unitSystem,
    specRevision: j.specRevision,
    buildPlan: (j.buildPlan ?? null) as CanonicalValue,
  };
}

export type Signature = { inspectorId: number; signedName: string; signedAt: Date };

/** The snapshot the hash is taken over: live rows of the job, the signature, and the gauges given. */
export function buildSnapshot(record: JobRecord, sig: Signature, gauges: (Rec & { id: number })[]): ReleaseSnapshot {
  return {
    release: {
      jobId: record.job.id,
      inspectorId: sig.inspectorId,
      signedName: sig.signedName,
      signedAt: isoUtc(sig.signedAt)!,
    },
    job: jobRecord(record),
    readings: record.readings.map(readingRecord),
    limits: record.limits.map(limitRecord),
    flags: record.flags.map(flagRecord),
    dispositions: record.dispositions.map(dispositionRecord),
    gauges,
  };
}
