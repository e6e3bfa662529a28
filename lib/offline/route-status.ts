// Where the machinist stands on a job's route: the state of every station, progress per
// section, and which station comes next. Pure: job pack and readings in, views out.
import {
  requiredProgress,
  requiredStationIds,
  type RequiredProgress,
  type SectionCounts,
  type Station,
  type Verdict,
} from "@/lib/domain";
import type { BenchFlag, JobPack } from "@/lib/schemas/sync";
import type { LocalReading } from "./db";
import { currentByStation, previewReadings, usableRaw } from "./preview";

export type StationState =
  | "todo"
  | "in_spec"
  | "marginal"
  | "out_of_spec"
  | "no_limit"
  | "skipped"
  | "rejected"
  /** Out of spec on its only reading: a confirming second reading is asked for. */
  | "confirm"
  /** The lead sent it back (measure again / machine again) and nothing newer was taken. */
  | "revisit";

export interface StationView {
  station: Station;
  index: number;
  state: StationState;
  current?: LocalReading;
  verdict?: Verdict;
  deviation?: number;
  /** Readings taken at this station that the server has not refused (history included). */
  count: number;
  revisit?: BenchFlag;
}

/** States still waiting for the machinist. */
export const OPEN_STATES: readonly StationState[] = ["todo", "confirm", "revisit", "rejected"];

function revisitFlag(flags: BenchFlag[], stationId: string, current?: LocalReading): BenchFlag | undefined {
  return flags.find(
    (f) => f.revisit && f.stations.includes(stationId) && !(current && f.disposedAt && current.takenAt > f.disposedAt),
  );
}

function stateOf(current: LocalReading | undefined, verdict: Verdict | undefined, count: number): StationState {
  if (!current) return "todo";
  if (current.state === "rejected") return "rejected";
  if (current.skipped) return "skipped";
  if (!verdict) return "no_limit";
  if (verdict === "out_of_spec" && count < 2) return "confirm";
  return verdict;
}

export function stationViews(pack: JobPack, readings: LocalReading[]): StationView[] {
  const current = currentByStation(readings);
  const previews = previewReadings(current, pack, usableRaw(readings, pack.instruments));
  const counts = new Map<string, number>();
  for (const r of readings) if (r.state !== "rejected") counts.set(r.stationId, (counts.get(r.stationId) ?? 0) + 1);
  const stations = pack.route.sections.flatMap((s) => s.stations);
  return stations.map((station, index) => {
    const cur = current.get(station.id);
    const preview = previews.get(station.id) ?? {};
    const count = counts.get(station.id) ?? 0;
    const revisit = revisitFlag(pack.flags, station.id, cur);
    const state = revisit ? "revisit" : stateOf(cur, preview.verdict, count);
    return {
      station,
      index,
      state,
      current: cur,
      verdict: preview.verdict,
      deviation: preview.evaluation?.deviation,
      count,
      ...(revisit ? { revisit } : {}),
    };
  });
}

/** Required-station counts (lib/domain/progress.ts), with the stations still waiting for the machinist. */
export interface SectionProgress extends SectionCounts {
  open: number;
}
export type RouteProgress = Omit<RequiredProgress, "sections"> & { sections: SectionProgress[] };

// The required stations depend only on the pack's engine and spec: worked out once per pack.
const requiredOf = new WeakMap<JobPack, Set<string>>();

/** The job's required-station progress, counted as the desk and the release checklist count it. */
export function routeProgress(pack: JobPack, views: StationView[]): RouteProgress {
  let required = requiredOf.get(pack);
  if (!required) requiredOf.set(pack, (required = requiredStationIds(pack.shape, pack.spec, pack.route)));
  const current = new Map(views.flatMap((v) => (v.current ? [[v.station.id, v.current] as const] : [])));
  const p = requiredProgress(pack.route, required, current);
  const open = new Map<string, number>();
  for (const v of views)
    if (OPEN_STATES.includes(v.state)) open.set(v.station.section, (open.get(v.station.section) ?? 0) + 1);
  return { ...p, sections: p.sections.map((s) => ({ ...s, open: open.get(s.id) ?? 0 })) };
}

/** A section's count in words: required stations done, or figures taken where none is required. */
export const sectionCount = (s: SectionCounts): string =>
  s.required ? `${s.done} of ${s.required} required` : `${s.measured} of ${s.stations} measured`;

/** The next station after `fromId` that still needs the machinist, in route order (wrapping). */
export function nextOpenStation(views: StationView[], fromId?: string): string | undefined {
  const start = fromId ? views.findIndex((v) => v.station.id === fromId) : -1;
  for (let k = 1; k <= views.length; k++) {
    const v = views[(start + k + views.length) % views.length];
    if (OPEN_STATES.includes(v.state) && v.station.id !== fromId) return v.station.id;
  }
  return undefined;
}
