import "server-only";
import {
  benchRoute,
  characteristicWords,
  deriveReadings,
  requiredProgress,
  requiredStations,
  type BenchRoute,
  type Station,
} from "@/lib/domain";
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

// Route and derived-value recipes depend only on the record's shape and spec; several checks
// ask for them, so each is worked out once per record.
type Route = { route?: BenchRoute; stations: Station[]; error?: string };
const routes = new WeakMap<object, Route>();
type Recipes = Map<string, { characteristic: string; stationId: string; inputs: string[] }>;
const recipes = new WeakMap<object, { shape: object; value: Recipes }>();

/** The engine's bench route as a flat list, or the reason it cannot be built. */
export function routeOf(record: Pick<JobRecord, "shape">): Route {
  let out = routes.get(record.shape);
  if (!out) {
    try {
      const route = benchRoute(record.shape);
      out = { route, stations: route.sections.flatMap((s) => s.stations) };
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
  // Required and done as the rest of the product counts them (lib/domain/progress.ts).
  const required = requiredStations(record.shape, record.spec, route.stations);
  const progress = requiredProgress(route.route!, new Set(required.map((r) => r.station.id)), current);
  const items: ChecklistItem[] = [];
  for (const { station, own, neededFor } of required) {
    const r = current.get(station.id);
    const words = [...neededFor].map((c) => characteristicWords(c).toLowerCase());
    const why = !own && words.length ? ` (needed for ${words.join(", ")})` : "";
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
  const { required: n, done } = progress;
  const summary =
    n === 0
      ? "The spec marks no station as required"
      : done === n
        ? `All ${plural(n, "required station")} have a current reading`
        : `${done} of ${plural(n, "required station")} have a current reading; ${n - done} to go`;
  return { id: "readings", title, ok: items.length === 0, summary, progress: { done, required: n }, items };
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
