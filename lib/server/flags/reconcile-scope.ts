import "server-only";
import { benchRoute, deriveReadings, parseStationId, type DerivedValue, type RawReading } from "@/lib/domain";
import type { JobContext } from "@/lib/server/jobs/context";
import type { StoredReading } from "@/lib/schemas/readings";

// What one reconciliation looks at. After a limits or gauge edit: everything. After ingest (the
// `fresh` readings): only what the fresh readings can change, which is
//   - their own stations (a correction is taken at the station it corrects, so a station's current
//     figure depends on that station's readings alone);
//   - every input of a derived value that one of their stations feeds (taper and out-of-round of a
//     bore or journal, piston-to-wall, oil clearances, bolt stretch: the core's own recipes);
//   - for a cylinder with a fresh bore or ring gap, all its bore and ring-gap stations (a ring
//     gap's limit scales with its cylinder's bore).
// Everything outside that set was judged against these same limits when it arrived or at the
// last reconciliation, and its flags were made to match then; reading it again would change
// nothing (tests/integration/flag-reconcile-scope.test.ts checks a full pass after ingest is a no-op).

export function derivedOf(
  raws: RawReading[],
  ctx: JobContext,
  touching?: (stationId: string) => boolean,
): DerivedValue[] {
  try {
    return deriveReadings(raws, ctx.shape, ctx.spec, touching ? { touching } : {});
  } catch {
    return []; // an engine shape the core refuses has no derived values to flag
  }
}

// Recipes and routes depend only on the shape and spec, so they are kept by their JSON (jobs made
// from one template share them) and, per context object, without even that JSON: ingest reuses one
// context per job revision (ingest-context.ts).
type Plan = { inputs: Map<string, string[]>; route: string[] };
const byValue = new Map<string, Plan>();
const byContext = new WeakMap<JobContext, Plan>();

function planOf(ctx: JobContext): Plan {
  let plan = byContext.get(ctx);
  if (plan) return plan;
  const key = JSON.stringify([ctx.shape, ctx.spec]);
  plan = byValue.get(key);
  if (!plan) {
    let route: string[] = [];
    try {
      route = benchRoute(ctx.shape).sections.flatMap((s) => s.stations.map((st) => st.id));
    } catch {
      // an engine shape the core refuses has no route
    }
    plan = { inputs: new Map(derivedOf([], ctx).map((d) => [d.key, d.inputs])), route };
    if (byValue.size >= 100) byValue.clear();
    byValue.set(key, plan);
  }
  byContext.set(ctx, plan);
  return plan;
}

/** Derived key → its input stations, for this job's shape and spec (the core's recipes). */
export const recipeInputs = (ctx: JobContext): Map<string, string[]> => planOf(ctx).inputs;
const routeStations = (ctx: JobContext): string[] => planOf(ctx).route;

const ringGapCoupled = (stationId: string) => stationId.startsWith("bore/") || stationId.startsWith("ring-gap/");

/** The stations whose readings an ingest reconciliation must read (see the top of this file). */
export function ingestStations(ctx: JobContext, freshStations: ReadonlySet<string>): string[] {
  const out = new Set(freshStations);
  for (const inputs of recipeInputs(ctx).values()) {
    if (inputs.some((s) => freshStations.has(s))) for (const s of inputs) out.add(s);
  }
  const cylinders = new Set([...freshStations].filter(ringGapCoupled).map((s) => parseStationId(s).cylinder));
  if (cylinders.size) {
    for (const id of routeStations(ctx))
      if (ringGapCoupled(id) && cylinders.has(parseStationId(id).cylinder)) out.add(id);
  }
  return [...out];
}

/**
 * Which current readings to judge again: all of them, or (ingest) only the ring gaps whose bore
 * changed. A fresh reading was judged by ingest against these same limits and gauge, and stored
 * with that verdict; only a ring gap's limit depends on other readings (its bore's diameter).
 */
export function toJudge(current: StoredReading[], fresh?: ReadonlyMap<string, string>): (r: StoredReading) => boolean {
  if (!fresh) return () => true;
  const cylinderOf = (r: StoredReading) => parseStationId(r.stationId).cylinder;
  const cylinders = new Set(current.filter((r) => fresh.has(r.id) && r.stationId.startsWith("bore/")).map(cylinderOf));
  return (r) => r.stationId.startsWith("ring-gap/") && (fresh.has(r.id) || cylinders.has(cylinderOf(r)));
}

/**
 * The derived values to recompute: all of them, or (ingest) those with a fresh reading among their
 * inputs, computed from just the readings they need. `inScope` tells which derived flags to revisit.
 */
export function derivedScope(
  ctx: JobContext,
  current: StoredReading[],
  raws: RawReading[],
  fresh?: ReadonlyMap<string, string>,
) {
  if (!fresh) return { derived: derivedOf(raws, ctx), inScope: (_key: string) => true };
  const freshStations = new Set(current.filter((r) => fresh.has(r.id)).map((r) => r.stationId));
  const affected = new Set<string>();
  for (const [key, inputs] of recipeInputs(ctx)) {
    if (!inputs.some((s) => freshStations.has(s))) continue;
    affected.add(key);
  }
  // The core computes just the values a fresh station feeds: the same set as `affected`.
  const derived = affected.size ? derivedOf(raws, ctx, (s) => freshStations.has(s)) : [];
  return { derived, inScope: (key: string) => affected.has(key) };
}
