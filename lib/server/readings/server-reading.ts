import "server-only";
import type { StoredReading } from "@/lib/schemas/readings";
import type { ServerReading } from "@/lib/schemas/sync";

// A stored reading as the tablet gets it (job pack and sync feed).

const iso = (d: Date | string) => (d instanceof Date ? d : new Date(d)).toISOString();

/**
 * The tablet's view of a stored reading: every field but the shop, in the stored order, times as ISO
 * text. One object literal (a fixed shape): a feed page maps a thousand, and copying field by field
 * in a loop cost several times the CPU (bench:scale). The type checks no field is left out.
 */
export function toServerReading(r: StoredReading, supersededBy: string | null): ServerReading {
  return {
    id: r.id,
    jobId: r.jobId,
    stationId: r.stationId,
    characteristic: r.characteristic,
    valueCanonical: r.valueCanonical,
    value: r.value,
    unit: r.unit,
    entryMode: r.entryMode,
    dialSetting: r.dialSetting,
    dialDeviation: r.dialDeviation,
    instrumentId: r.instrumentId,
    partTempC: r.partTempC,
    gaugeTempC: r.gaugeTempC,
    lubricant: r.lubricant,
    skipped: r.skipped,
    skipReason: r.skipReason,
    note: r.note,
    takenBy: r.takenBy,
    takenAt: iso(r.takenAt),
    receivedAt: iso(r.receivedAt),
    deviceId: r.deviceId,
    supersedes: r.supersedes,
    verdict: r.verdict,
    verdictNote: r.verdictNote,
    limitMin: r.limitMin,
    limitMax: r.limitMax,
    deviation: r.deviation,
    supersededBy,
  };
}
