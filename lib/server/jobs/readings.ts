import "server-only";
import { benchRoute, currentReadings, currentValues, requiredProgress, requiredStationIds } from "@/lib/domain";
import type { RawReading } from "@/lib/domain";
import type { UnitSystem } from "@/lib/schemas/enums";
import { toRaw, type InstrumentInfo } from "@/lib/server/sync/ingest-evaluate";
import { toEngineShape } from "@/lib/server/jobs/context";
import type { StoredReading } from "@/lib/schemas/readings";
import { jobReadings } from "@/lib/server/readings/repo";
import { findInstruments } from "@/lib/server/readings/gauge-repo";
import { jobSpecs, readingChains, type EngineRow } from "@/lib/server/jobs/repo";
import { listUsers } from "@/lib/server/users/repo";

// A job's readings as the desk and the bench list read them, through the rules in lib/domain:
// the current reading of each station (current-reading.ts) and required-station progress
// (progress.ts), the same functions the tablet and the release checklist call.

export type Progress = { done: number; required: number };

/**
 * Required-station progress of each job with an engine (jobs without one are absent). An engine
 * the core cannot lay out has no route: 0 of 0, and the job page says why.
 */
export async function progressOfJobs(
  shopId: number,
  jobs: { id: number; unitSystem: UnitSystem; engine?: EngineRow | null }[],
): Promise<Map<number, Progress>> {
  const withEngine = jobs.filter((j) => j.engine);
  const ids = withEngine.map((j) => j.id);
  const out = new Map<number, Progress>();
  if (!ids.length) return out;
  const [specs, chains] = await Promise.all([jobSpecs(ids), readingChains(shopId, ids)]);
  const byJob = new Map<number, typeof chains>(ids.map((id) => [id, []]));
  for (const r of chains) byJob.get(r.jobId)?.push(r);
  for (const j of withEngine) {
    try {
      const shape = toEngineShape(j.engine!, j);
      const route = benchRoute(shape);
      const required = requiredStationIds(shape, specs.get(j.id)!, route);
      const p = requiredProgress(route, required, currentReadings(byJob.get(j.id)!));
      out.set(j.id, { done: p.done, required: p.required });
    } catch {
      out.set(j.id, { done: 0, required: 0 });
    }
  }
  return out;
}

export type JobReadings = {
  all: StoredReading[];
  /** The current readings that carry a figure (lib/domain currentValues). */
  current: StoredReading[];
  /** `current` in the core's shape, with gauge U and temperatures, for deriveReadings. */
  raws: RawReading[];
  instruments: Map<number, InstrumentInfo>;
  takers: Map<number, string>;
};

/** A job's readings and gauges as JobReadings (current figures and the core's raw shape); no takers. */
export function jobReadingsFrom(all: StoredReading[], instruments: Map<number, InstrumentInfo>): JobReadings {
  const current = currentValues(all);
  const raws = current.map((r) => toRaw(r, r.instrumentId ? instruments.get(r.instrumentId) : undefined));
  return { all, current, raws, instruments, takers: new Map() };
}

/** With the shop's people, to name who took each reading. */
export async function loadJobReadings(shopId: number, jobId: number): Promise<JobReadings> {
  const all = await jobReadings(undefined, jobId);
  const [instruments, users] = await Promise.all([
    findInstruments(
      undefined,
      shopId,
      all.flatMap((r) => (r.instrumentId ? [r.instrumentId] : [])),
    ),
    listUsers(shopId),
  ]);
  return { ...jobReadingsFrom(all, instruments), takers: new Map(users.map((u) => [u.id, u.name])) };
}
