import "server-only";
import { derivedInputs, type EngineShape } from "@/lib/domain";
import type { BenchFlag } from "@/lib/schemas/sync";
import type { FlagRow } from "@/lib/server/reconcile/repo";

// A stored flag as the tablet gets it (job pack and sync feed).

const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);

export type RecipeInputs = ReadonlyMap<string, readonly string[]>;

/**
 * Derived key → the stations it is computed from (the core's recipes, which follow the engine's
 * shape alone), so a derived flag can mark what to measure again. An engine the core refuses has
 * no derived values; its flags mark their own station.
 */
export function recipeInputs(shape: EngineShape): RecipeInputs {
  try {
    return derivedInputs(shape);
  } catch {
    return new Map();
  }
}

/** `inputs` maps a derived key to the stations it is computed from (recipeInputs). */
export function toBenchFlag(f: FlagRow, inputs: RecipeInputs): BenchFlag {
  const stations = [...((f.derivedKey && inputs.get(f.derivedKey)) || [f.stationId])];
  return {
    id: f.id,
    jobId: f.jobId,
    readingId: f.readingId,
    derivedKey: f.derivedKey,
    stationId: f.stationId,
    characteristic: f.characteristic,
    value: f.value,
    unit: f.unit,
    limitMin: f.limitMin,
    limitMax: f.limitMax,
    deviation: f.deviation,
    verdict: f.verdict,
    reason: f.reason,
    state: f.state,
    disposition: f.disposition,
    operation: f.operation,
    dispositionReason: f.dispositionReason,
    disposedAt: iso(f.disposedAt),
    closedAt: iso(f.closedAt),
    createdAt: iso(f.createdAt) as string,
    stations,
    revisit: f.state === "disposed" && (f.disposition === "measure_again" || f.disposition === "machine_again"),
  };
}
