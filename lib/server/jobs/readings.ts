import "server-only";
import type { RawReading, Station } from "@/lib/domain";
import { toRaw, type InstrumentInfo } from "@/lib/server/sync/ingest-evaluate";
import type { JobContext } from "@/lib/server/jobs/context";
import {
  currentReadings as releaseCurrent,
  requiredStations as releaseRequired,
} from "@/lib/server/release/checklist-rules";
import type { JobRecord } from "@/lib/server/release/repo";
import type { StoredReading } from "@/lib/schemas/readings";
import { currentReadings, findInstruments, jobReadings } from "@/lib/server/readings/repo";
import { readingChains } from "@/lib/server/jobs/repo";
import { listUsers } from "@/lib/server/users/repo";

// A job's readings as the desk reads them, through the rules the rest of the server uses:
// - progress toward release follows the release checklist (release-checklist-rules.ts): the
//   required stations (own required limit, or an input of a required derived value) and the
//   current reading of each (a skip counts as not measured);
// - values, verdicts and derived values follow flag reconciliation (readings-repo currentReadings,
//   ingest-evaluate toRaw), so the desk, the CSV and the flags never disagree.

/** The release checklist's required stations of a route (it reads only the spec and the shape). */
export function requiredStationIds(ctx: Pick<JobContext, "spec" | "shape">, stations: Station[]): string[] {
  return releaseRequired({ spec: ctx.spec, shape: ctx.shape } as JobRecord, stations).map((r) => r.station.id);
}

/** Per job, the stations whose current reading (release rule) is a measured value, not a skip. */
export async function measuredStations(shopId: number, jobIds: number[]): Promise<Map<number, Set<string>>> {
  const out = new Map<number, Set<string>>(jobIds.map((id) => [id, new Set()]));
  const byJob = new Map<number, StoredReading[]>();
  for (const r of await readingChains(shopId, jobIds))
    (byJob.get(r.jobId) ?? byJob.set(r.jobId, []).get(r.jobId)!).push(r as StoredReading);
  for (const [jobId, list] of byJob) {
    for (const r of releaseCurrent(list).values()) if (!r.skipped) out.get(jobId)?.add(r.stationId);
  }
  return out;
}

export type JobReadings = {
  all: StoredReading[];
  /** The current value of each station (reconciliation's rule). */
  current: StoredReading[];
  /** `current` in the core's shape, with gauge U and temperatures, for deriveReadings. */
  raws: RawReading[];
  instruments: Map<number, InstrumentInfo>;
  takers: Map<number, string>;
};

export async function loadJobReadings(shopId: number, jobId: number): Promise<JobReadings> {
  const all = await jobReadings(undefined, jobId);
  const current = currentReadings(all);
  const [instruments, users] = await Promise.all([
    findInstruments(
      undefined,
      shopId,
      all.flatMap((r) => (r.instrumentId ? [r.instrumentId] : [])),
    ),
    listUsers(shopId),
  ]);
  const raws = current.map((r) => toRaw(r, r.instrumentId ? instruments.get(r.instrumentId) : undefined));
  return { all, current, raws, instruments, takers: new Map(users.map((u) => [u.id, u.name])) };
}
