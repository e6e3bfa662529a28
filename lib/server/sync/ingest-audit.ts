import "server-only";
import type { ReadingEvaluation } from "@/lib/schemas/sync";
import type { Actor } from "@/lib/schemas/session";
import type { AuditInput } from "@/lib/server/log/repo";
import type { StoredReading } from "@/lib/schemas/readings";

// The audit trail of POST /api/sync: ONE event per job per batch, action "readings.sync" on the
// job, listing every new reading of that job exactly once (id, station, value, unit, verdict as
// stored after reconciliation, what it corrects). The readings table is itself append-only and
// keeps who took each reading (taken_by), when, on which device and all its figures; this event
// says which upload brought them, in the same transaction. It replaces one "reading.create" /
// "reading.correct" event per reading (three rows written per reading made ingest slow, see
// bench:sync). Flags keep one event per flag; re-evaluations keep one per reading.

export const SYNC_ACTION = "readings.sync";

export type SyncedReading = {
  id: string;
  stationId: string;
  value: number | null;
  unit: string;
  verdict: ReadingEvaluation["verdict"];
  supersedes: string | null;
  skipped?: true;
};
export type SyncAuditAfter = { jobId: number; deviceId: string; count: number; readings: SyncedReading[] };

function entry(r: StoredReading, final: ReadingEvaluation | undefined): SyncedReading {
  return {
    id: r.id,
    stationId: r.stationId,
    value: r.value,
    unit: r.unit,
    verdict: final?.verdict ?? r.verdict,
    supersedes: r.supersedes,
    ...(r.skipped ? { skipped: true as const } : {}),
  };
}

/** One "readings.sync" event per job of the batch, its readings in the order they were sent. */
export function syncAudits(
  actor: Actor,
  deviceId: string,
  fresh: StoredReading[],
  finals: Map<string, ReadingEvaluation>,
): AuditInput[] {
  const byJob = new Map<number, SyncedReading[]>();
  for (const r of fresh) {
    const list = byJob.get(r.jobId) ?? [];
    list.push(entry(r, finals.get(r.id)));
    byJob.set(r.jobId, list);
  }
  return [...byJob].map(([jobId, readings]) => {
    const after: SyncAuditAfter = { jobId, deviceId, count: readings.length, readings };
    return {
      shopId: actor.shopId,
      userId: actor.userId,
      action: SYNC_ACTION,
      entityType: "job",
      entityId: jobId,
      after,
    };
  });
}
