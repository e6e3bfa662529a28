// What a new reading can change, worked out from the core's own recipes and limits (never from
// station-id prefixes): the server reconciles only that after an upload, and a test checks a full
// pass afterwards finds nothing left to change.
//   - the derived values that have the station among their inputs (taper, out-of-round,
//     piston-to-wall, oil clearance, bolt stretch);
//   - the verdicts whose limit reads the station (a ring gap's limit may scale with its bore), and
//     the station's own when its limit reads other stations;
//   - the readings needed to work all of that out again.
// A station's own verdict otherwise depends on its own reading alone, which was judged on arrival.
import { benchRoute } from "./bench-route";
import { derivedInputs, limitInputs } from "./derive";
import { partOf } from "./stations";
import type { EngineShape } from "./types";

export interface ReadingReach {
  /** Keys of the derived values with an input among the stations. */
  derived: Set<string>;
  /** Stations whose verdict must be worked out again. */
  rejudge: Set<string>;
  /** Every station whose reading that needs: the stations, the derived values' inputs, what the limits read. */
  reads: Set<string>;
}

type Index = { byInput: Map<string, string[]>; dependents: Map<string, string[]> };
const indexCache = new Map<string, Index>();

// Which derived values each station feeds, and which stations' limits read it; per engine shape.
function indexOf(engine: EngineShape): Index {
  const key = JSON.stringify(engine);
  let index = indexCache.get(key);
  if (index) return index;
  index = { byInput: new Map(), dependents: new Map() };
  const push = (map: Map<string, string[]>, at: string, value: string) =>
    void (map.get(at) ?? map.set(at, []).get(at)!).push(value);
  for (const [derived, inputs] of derivedInputs(engine)) for (const s of inputs) push(index.byInput, s, derived);
  for (const section of benchRoute(engine).sections)
    for (const { id } of section.stations) for (const s of limitInputs(id)) push(index.dependents, s, id);
  if (indexCache.size > 50) indexCache.clear();
  indexCache.set(key, index);
  return index;
}

/** What new readings at `stations` can change on a job with this engine (see the top of this file). */
export function readingReach(engine: EngineShape, stations: Iterable<string>): ReadingReach {
  const { byInput, dependents } = indexOf(engine);
  const inputs = derivedInputs(engine);
  const reach: ReadingReach = { derived: new Set(), rejudge: new Set(), reads: new Set() };
  for (const s of stations) {
    reach.reads.add(s);
    for (const d of byInput.get(s) ?? []) reach.derived.add(d);
    if (limitInputs(s).length) reach.rejudge.add(s);
    for (const other of dependents.get(s) ?? []) reach.rejudge.add(other);
  }
  for (const d of reach.derived) for (const s of inputs.get(d) ?? []) reach.reads.add(s);
  for (const s of reach.rejudge) {
    reach.reads.add(s);
    for (const input of limitInputs(s)) reach.reads.add(input);
  }
  return reach;
}

/** The stations on the same part as `stationId` (the bench shows that part's derived values). */
export function onSamePart(stationId: string): (other: string) => boolean {
  const part = partOf(stationId);
  return (other) => partOf(other) === part;
}
