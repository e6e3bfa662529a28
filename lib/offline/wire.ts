// The one edge between the tablet's rows and the sync contract (lib/schemas/sync.ts): what is
// sent for a reading, and how a server copy becomes a local row. Types only from the contract,
// so zod stays out of the bench bundle.
import type { Lubricant, MeasureUnit } from "@/lib/domain";
import type { PushReadingInput, ServerReading } from "@/lib/schemas/sync";
import type { LocalReading } from "./db";

/** The push payload for a reading: only fields that hold something (the server reads absence as "none"). */
export function toPushReading(r: LocalReading): PushReadingInput {
  const out: PushReadingInput = {
    id: r.id,
    jobId: r.jobId,
    stationId: r.stationId,
    unit: r.unit,
    entryMode: r.entryMode,
    takenAt: r.takenAt,
    value: r.skipped ? null : r.value,
  };
  if (r.skipped) Object.assign(out, { skipped: true, skipReason: r.skipReason });
  const optional = [
    "dialSetting",
    "dialDeviation",
    "instrumentId",
    "partTempC",
    "gaugeTempC",
    "lubricant",
    "supersedes",
    "note",
  ] as const;
  for (const k of optional) {
    const v = r[k];
    if (v !== undefined && v !== null && v !== "") (out as Record<string, unknown>)[k] = v;
  }
  return out;
}

const opt = <T>(v: T | null | undefined): T | undefined => (v === null ? undefined : v);

/** A reading as the server holds it, as a synced local row (keeping what only the tablet knows). */
export function fromServerReading(s: ServerReading, local?: LocalReading): LocalReading {
  return {
    id: s.id,
    jobId: s.jobId,
    stationId: s.stationId,
    value: s.value,
    unit: s.unit as MeasureUnit,
    entryMode: s.entryMode,
    dialSetting: opt(s.dialSetting),
    dialDeviation: opt(s.dialDeviation),
    instrumentId: opt(s.instrumentId),
    partTempC: opt(s.partTempC),
    gaugeTempC: opt(s.gaugeTempC),
    lubricant: opt(s.lubricant) as Lubricant | undefined,
    skipped: s.skipped,
    skipReason: opt(s.skipReason),
    supersedes: opt(s.supersedes),
    note: opt(s.note),
    takenAt: s.takenAt,
    deviceId: s.deviceId,
    takenBy: s.takenBy,
    state: "synced",
    verdict: s.verdict,
    verdictNote: s.verdictNote,
    deviation: s.deviation,
    limitMin: s.limitMin,
    limitMax: s.limitMax,
    supersededBy: s.supersededBy,
    updatedAt: local?.updatedAt && local.updatedAt > s.receivedAt ? local.updatedAt : s.receivedAt,
  };
}
