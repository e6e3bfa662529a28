import "server-only";
import type { DerivedValue } from "@/lib/domain";
import type { ReadingEvaluation } from "@/lib/schemas/sync";
import type { FlagPatch, NewFlag, UnclosedFlag } from "@/lib/server/reconcile/repo";
import { round6 } from "@/lib/server/sync/ingest-evaluate";
import type { StoredReading } from "@/lib/schemas/readings";

// The pure half of flag reconciliation: from current values and the flags that are not closed,
// decide which flags to open, update and close. No database here (reconcile.ts writes).

/** The reading that replaces a value, and the value now standing there. */
export type Closer = { id: string | null; value: number | null };
export type FlagPlan = {
  open: NewFlag[];
  update: { flag: UnclosedFlag; patch: FlagPatch }[];
  close: { flag: UnclosedFlag; closedByReadingId: string | null }[];
};

/** Flag reason for a raw reading: out_of_spec, then the gauge (past due, study failed or due), then marginal. */
function rawReason(e: ReadingEvaluation): NewFlag["reason"] | null {
  if (e.verdict === "out_of_spec") return "out_of_spec";
  if (e.verdictNote === "gauge_past_due") return "gauge_past_due";
  if (e.verdictNote === "gauge_study_failed" || e.verdictNote === "gauge_study_due") return e.verdictNote;
  return e.verdict === "marginal" ? "marginal" : null;
}

export function wantedRaw(r: StoredReading, e: ReadingEvaluation): NewFlag | null {
  const reason = rawReason(e);
  if (!reason) return null;
  return {
    shopId: r.shopId,
    jobId: r.jobId,
    readingId: r.id,
    derivedKey: null,
    stationId: r.stationId,
    characteristic: r.characteristic,
    value: r.value as number,
    unit: r.unit,
    limitMin: e.limitMin,
    limitMax: e.limitMax,
    deviation: e.deviation,
    verdict: e.verdict ?? "in_spec",
    reason,
  };
}

export function wantedDerived(shopId: number, jobId: number, d: DerivedValue): NewFlag | null {
  if ((d.verdict !== "out_of_spec" && d.verdict !== "marginal") || d.value === undefined) return null;
  return {
    shopId,
    jobId,
    readingId: null,
    derivedKey: d.key,
    stationId: d.stationId,
    characteristic: d.characteristic,
    value: round6(d.value) as number,
    unit: d.unit,
    limitMin: round6(d.limits?.min),
    limitMax: round6(d.limits?.max),
    deviation: round6(d.deviation),
    verdict: d.verdict,
    reason: d.verdict,
  };
}

/** Newest input reading of a derived value (by takenAt): what closes its old flag. */
export function newestInput(d: DerivedValue, byStation: Map<string, StoredReading>): string | null {
  let newest: StoredReading | undefined;
  for (const s of d.inputs) {
    const r = byStation.get(s);
    if (r && (!newest || r.takenAt.getTime() >= newest.takenAt.getTime())) newest = r;
  }
  return newest?.id ?? null;
}

function patchOf(f: UnclosedFlag, w: NewFlag): FlagPatch | null {
  const patch: FlagPatch = {};
  if (f.verdict !== w.verdict) patch.verdict = w.verdict;
  if (f.reason !== w.reason) patch.reason = w.reason;
  for (const k of ["limitMin", "limitMax", "deviation"] as const) if (round6(f[k]) !== round6(w[k])) patch[k] = w[k];
  return Object.keys(patch).length ? patch : null;
}

/**
 * `wanted`: the flags the values call for, keyed "r:<readingId>" or "d:<derivedKey>".
 * `closers`: keyed "s:<stationId>" (raw) or "d:<derivedKey>". A flag keeps living while its value
 * stands (same reading; same derived value); otherwise it is closed, naming the newer reading —
 * or none when the value is unchanged and only the limits moved.
 */
export function planFlags(flags: UnclosedFlag[], wanted: Map<string, NewFlag>, closers: Map<string, Closer>): FlagPlan {
  const plan: FlagPlan = { open: [], update: [], close: [] };
  const left = new Map(wanted);
  for (const f of flags) {
    const key = f.readingId ? `r:${f.readingId}` : `d:${f.derivedKey}`;
    const w = left.get(key);
    if (w && (f.readingId || round6(f.value) === w.value)) {
      left.delete(key);
      const patch = patchOf(f, w);
      if (patch) plan.update.push({ flag: f, patch });
      continue;
    }
    const closer = closers.get(f.readingId ? `s:${f.stationId}` : `d:${f.derivedKey}`);
    const sameValue = f.readingId ? closer?.id === f.readingId : closer?.value === round6(f.value);
    plan.close.push({ flag: f, closedByReadingId: !closer || sameValue ? null : closer.id });
  }
  plan.open = [...left.values()];
  return plan;
}
