// How far a job is toward release (rule of this product): "n of m required stations done", in all
// and per section of the bench route. The tablet's job list and section strip, the desk's jobs
// board and job page and the release checklist all count with these functions, so one job shows
// one set of figures everywhere.
//
// - Required: a station whose own characteristic has a `required` limit there, or an input of a
//   derived value with a required limit (an oil clearance needs both the bearing bore and the
//   journal), else a required clearance could go unmeasured. Stations off the engine's route
//   never count.
// - Done: the station's current reading (current-reading.ts) is a figure. A skip is not done: the
//   release checklist refuses a skipped required station, so progress does not count it either.
//   A reading the server refused (kept on the tablet to show why) is not done.
import { benchRoute, checkEngineShape } from "./bench-route";
import { currentReadings, type ChainedReading, type CurrentOptions } from "./current-reading";
import { recipes } from "./derive-recipes";
import { findLimit } from "./limits";
import type {
  BenchRoute,
  CharacteristicId,
  DerivedCharacteristic,
  EngineShape,
  SectionId,
  SpecLimit,
  Station,
} from "./types";

export interface RequiredStation {
  station: Station;
  /** The station's own characteristic has a required limit there. */
  own: boolean;
  /** Derived values with a required limit that are computed from this station. */
  neededFor: Set<DerivedCharacteristic>;
}

/** The required stations among `stations` (route order kept). */
export function requiredStations(
  shape: EngineShape,
  spec: SpecLimit[],
  stations: readonly Station[],
): RequiredStation[] {
  const byId = new Map(stations.map((s) => [s.id, s]));
  const need = new Map<string, RequiredStation>();
  const add = (id: string, why?: DerivedCharacteristic) => {
    const station = byId.get(id);
    if (!station) return;
    const entry = need.get(id) ?? { station, own: false, neededFor: new Set<DerivedCharacteristic>() };
    if (why) entry.neededFor.add(why);
    else entry.own = true;
    need.set(id, entry);
  };
  for (const s of stations) if (findLimit(spec, s.characteristic, s.id)?.required) add(s.id);
  for (const d of derivedRecipes(shape)) {
    if (findLimit(spec, d.characteristic as CharacteristicId, d.stationId)?.required)
      for (const id of d.inputs) add(id, d.characteristic);
  }
  return stations.filter((s) => need.has(s.id)).map((s) => need.get(s.id)!);
}

/**
 * Every derived value's recipe (what it is computed from); none when the engine cannot be laid out.
 * The recipes alone, not a derivation pass without readings: that resolved every value's limits
 * only for them to go unused, most of the job page's CPU (scripts/bench/job-page-cpu.ts).
 */
function derivedRecipes(shape: EngineShape) {
  try {
    checkEngineShape(shape);
    return recipes(shape);
  } catch {
    return [];
  }
}

/** What progress needs to know of a station's current reading. */
export interface DoneFacts {
  skipped?: boolean | null;
  /** The tablet's sync state: "rejected" when the server refused it. */
  state?: string;
}

/** Whether a station whose current reading is `r` counts as done. */
export const stationDone = (r: DoneFacts | undefined): boolean => !!r && !r.skipped && r.state !== "rejected";

export interface SectionCounts {
  id: SectionId;
  label: string;
  /** Stations of the section on this engine's route. */
  stations: number;
  /** Of those, the ones whose current reading is a figure (required or not). */
  measured: number;
  required: number;
  /** Required stations done. */
  done: number;
}

export interface RequiredProgress {
  required: number;
  done: number;
  sections: SectionCounts[];
}

/** Progress from the route, the required station ids and each station's current reading. */
export function requiredProgress(
  route: BenchRoute,
  required: ReadonlySet<string>,
  current: ReadonlyMap<string, DoneFacts>,
): RequiredProgress {
  const sections = route.sections.map((s): SectionCounts => {
    let measured = 0;
    let need = 0;
    let done = 0;
    for (const st of s.stations) {
      const ok = stationDone(current.get(st.id));
      if (ok) measured += 1;
      if (!required.has(st.id)) continue;
      need += 1;
      if (ok) done += 1;
    }
    return { id: s.id, label: s.label, stations: s.stations.length, measured, required: need, done };
  });
  return {
    required: sections.reduce((n, s) => n + s.required, 0),
    done: sections.reduce((n, s) => n + s.done, 0),
    sections,
  };
}

/** The ids of the required stations of a route. */
export function requiredStationIds(shape: EngineShape, spec: SpecLimit[], route: BenchRoute): Set<string> {
  return new Set(
    requiredStations(
      shape,
      spec,
      route.sections.flatMap((s) => s.stations),
    ).map((r) => r.station.id),
  );
}

/**
 * A job's progress from its engine, spec and every reading it has (history included). Throws
 * when the engine cannot be laid out as a route; callers say so rather than show a count.
 */
export function jobProgress<R extends ChainedReading & DoneFacts>(
  shape: EngineShape,
  spec: SpecLimit[],
  readings: readonly R[],
  options: CurrentOptions<R> = {},
): RequiredProgress {
  const route = benchRoute(shape);
  return requiredProgress(route, requiredStationIds(shape, spec, route), currentReadings(readings, options));
}
