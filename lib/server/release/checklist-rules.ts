import "server-only";
import { benchRoute, characteristicWords, deriveReadings, findLimit, type Station } from "@/lib/domain";
import type { ChecklistCheck, ChecklistItem, ChecklistLink } from "@/lib/schemas/release";
import type { JobRecord } from "@/lib/server/release/repo";
import type { StoredReading } from "@/lib/schemas/readings";

// The readings and torque checks of the release checklist, and the helpers the other checks
// share. Pure: a JobRecord in, checks out; no database, no clock.

export const benchLink = (jobId: number, stationId: string): ChecklistLink => ({
  label: "Open on the bench",
  href: `/bench/${jobId}?station=${encodeURIComponent(stationId)}`,
});

export const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/**
 * The current reading of each station: among readings no other reading supersedes, the latest
 * by takenAt (then by server receipt, then id, so the choice never depends on query order).
 */
export function currentReadings(readings: StoredReading[]): Map<string, StoredReading> {
  const superseded = new Set(readings.map((r) => r.supersedes).filter((id): id is string => !!id));
  const out = new Map<string, StoredReading>();
  for (const r of readings) {
    if (superseded.has(r.id)) continue;
    const had = out.get(r.stationId);
    if (!had || later(r, had)) out.set(r.stationId, r);
  }
  return out;
}

function later(a: StoredReading, b: StoredReading): boolean {
  const d = new Date(a.takenAt).getTime() - new Date(b.takenAt).getTime();
  if (d !== 0) return d > 0;
  const e = new Date(a.receivedAt).getTime() - new Date(b.receivedAt).getTime();
  return e !== 0 ? e > 0 : a.id > b.id;
}

// Route and derived-value recipes depend only on the record's shape and spec; several checks
// ask for them, so each is worked out once per record.
const routes = new WeakMap<object, { stations: Station[]; error?: string }>();
type Recipes = Map<string, { characteristic: string; stationId: string; inputs: string[] }>;
const recipes = new WeakMap<object, { shape: object; value: Recipes }>();

/** The engine's bench route as a flat list, or the reason it cannot be built. */
export function routeOf(record: Pick<JobRecord, "shape">): { stations: Station[]; error?: string } {
  let out = routes.get(record.shape);
  if (!out) {
    try {
      out = { stations: benchRoute(record.shape).sections.flatMap((s) => s.stations) };
    } catch (err) {
      out = { stations: [], error: err instanceof Error ? err.message : String(err) };
    }
    routes.set(record.shape, out);
  }
  return out;
}

/** Derived values (by key) with the stations they are computed from; empty if the shape is bad. */
export function derivedInputs(record: Pick<JobRecord, "shape" | "spec">): Recipes {
  const had = recipes.get(record.spec);
  if (had && had.shape === record.shape) return had.value;
  let value: Recipes;
  try {
    value = new Map(deriveReadings([], record.shape, record.spec).map((d) => [d.key, d]));
  } catch {
    value = new Map();
  }
  recipes.set(record.spec, { shape: record.shape, value });
  return value;
}

/** `own`: the station's own characteristic is required; else `neededFor` names the derived values that need it. */
type Required = { station: Station; own: boolean; neededFor: Set<string> };

/**
 * Required stations: those whose own characteristic has a `required` limit there, and the inputs
 * of every derived value with a required limit (oil clearance needs both the bearing bore and
 * the journal, stretch needs both bolt lengths) — else a required clearance could go unmeasured.
 */
export function requiredStations(record: Pick<JobRecord, "shape" | "spec">, stations: Station[]): Required[] {
  const byId = new Map(stations.map((s) => [s.id, s]));
  const need = new Map<string, Required>();
  const add = (id: string, why?: string) => {
    const station = byId.get(id);
    if (!station) return;
    const entry = need.get(id) ?? { station, own: false, neededFor: new Set<string>() };
    if (why) entry.neededFor.add(why);
    else entry.own = true;
    need.set(id, entry);
  };
  for (const s of stations) if (findLimit(record.spec, s.characteristic, s.id)?.required) add(s.id);
  for (const d of derivedInputs(record).values()) {
    const limit = findLimit(record.spec, d.characteristic as never, d.stationId);
    if (limit?.required) for (const id of d.inputs) add(id, characteristicWords(d.characteristic).toLowerCase());
  }
  return stations.filter((s) => need.has(s.id)).map((s) => need.get(s.id)!);
}

function shapeProblem(record: JobRecord, check: "readings" | "torque", error: string): ChecklistItem {
  return {
    check,
    key: `${check}:shape`,
    text: `The engine as entered cannot give a bench route (${error}); fix the job's engine first`,
    links: [{ label: "Open the job", href: `/desk/jobs/${record.job.id}` }],
  };
}

export function readingsCheck(record: JobRecord, current: Map<string, StoredReading>): ChecklistCheck {
  const title = "Every required station has a current reading";
  const route = routeOf(record);
  if (route.error)
    return {
      id: "readings",
      title,
      ok: false,
      summary: "No bench route",
      items: [shapeProblem(record, "readings", route.error)],
    };
  const required = requiredStations(record, route.stations);
  const items: ChecklistItem[] = [];
  for (const { station, own, neededFor } of required) {
    const r = current.get(station.id);
    const why = !own && neededFor.size ? ` (needed for ${[...neededFor].join(", ")})` : "";
    const base = {
      check: "readings" as const,
      key: `readings:${station.id}`,
      links: [benchLink(record.job.id, station.id)],
    };
    if (!r) items.push({ ...base, text: `${station.label}: no reading yet${why}` });
    else if (r.skipped) {
      items.push({
        ...base,
        text: `${station.label}: skipped${r.skipReason ? ` ("${r.skipReason}")` : ""}; a required station must be measured${why}`,
      });
    }
  }
  const n = required.length;
  const summary =
    n === 0
      ? "The spec marks no station as required"
      : items.length === 0
        ? `All ${plural(n, "required station")} have a current reading`
        : `${n - items.length} of ${plural(n, "required station")} have a current reading; ${items.length} to go`;
  return { id: "readings", title, ok: items.length === 0, summary, items };
}

export function torqueCheck(record: JobRecord, current: Map<string, StoredReading>): ChecklistCheck {
  const title = "Torque records are complete, with the lubricant";
  const route = routeOf(record);
  if (route.error)
    return {
      id: "torque",
      title,
      ok: false,
      summary: "No bench route",
      items: [shapeProblem(record, "torque", route.error)],
    };
  const torque = route.stations.filter((s) => s.torque);
  const items: ChecklistItem[] = [];
  for (const s of torque) {
    const r = current.get(s.id);
    const base = { check: "torque" as const, key: `torque:${s.id}`, links: [benchLink(record.job.id, s.id)] };
    if (!r) items.push({ ...base, text: `${s.label}: no torque record yet` });
    else if (r.skipped)
      items.push({ ...base, text: `${s.label}: skipped; every fastener group needs its torque record` });
    else if (!r.lubricant)
      items.push({
        ...base,
        text: `${s.label}: no lubricant recorded; enter the torque again with the lubricant used`,
      });
  }
  const summary =
    torque.length === 0
      ? "This engine's route has no torque groups"
      : items.length === 0
        ? `All ${plural(torque.length, "fastener group")} have a torque record with the lubricant`
        : `${torque.length - items.length} of ${plural(torque.length, "fastener group")} complete; ${items.length} to go`;
  return { id: "torque", title, ok: items.length === 0, summary, items };
}
