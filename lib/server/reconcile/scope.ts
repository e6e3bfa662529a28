import "server-only";
import { deriveReadings, readingReach, type DerivedValue, type RawReading, type ReadingReach } from "@/lib/domain";
import type { JobContext } from "@/lib/server/jobs/context";
import type { StoredReading } from "@/lib/schemas/readings";

// What one reconciliation looks at. After a limits or gauge edit: everything. After ingest (the
// `fresh` readings): only what the fresh readings can change, as the core's readingReach works it
// out from its recipes and limits. Everything outside that was judged against these same limits
// when it arrived or at the last reconciliation, and its flags were made to match then; reading it
// again would change nothing (tests/integration/flag-reconcile-scope.test.ts checks a full pass
// after ingest is a no-op).

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

// An engine shape the core refuses has no route or recipes: only the fresh stations themselves.
function reachOf(ctx: JobContext, stations: ReadonlySet<string>): ReadingReach {
  try {
    return readingReach(ctx.shape, stations);
  } catch {
    return { derived: new Set(), rejudge: new Set(), reads: new Set(stations) };
  }
}

/** The stations whose readings an ingest reconciliation must read. */
export function ingestStations(ctx: JobContext, freshStations: ReadonlySet<string>): string[] {
  return [...reachOf(ctx, freshStations).reads];
}

/**
 * Which current readings to judge again: all of them, or (ingest) only those whose limit reads
 * other stations' readings (a ring gap's bore) where one of those, or they, are fresh. A fresh
 * reading was otherwise judged by ingest against these same limits and gauge, and stored so.
 */
export function toJudge(ctx: JobContext, fresh?: ReadonlyMap<string, string>): (r: StoredReading) => boolean {
  if (!fresh) return () => true;
  const again = reachOf(ctx, new Set(fresh.values())).rejudge;
  return (r) => again.has(r.stationId);
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
  const affected = reachOf(ctx, freshStations).derived;
  // The core computes just the values a fresh station feeds: the same set as `affected`.
  const derived = affected.size ? derivedOf(raws, ctx, (s) => freshStations.has(s)) : [];
  return { derived, inScope: (key: string) => affected.has(key) };
}
