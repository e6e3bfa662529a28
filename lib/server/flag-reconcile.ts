import "server-only";
import type { Transaction } from "sequelize";
import { deriveReadings, evaluateReading, type DerivedValue, type RawReading } from "@/lib/domain";
import type { ReadingEvaluation } from "@/lib/schemas/sync";
import { createFlags, unclosedFlags, updateFlag, type FlagPatch, type FlagRow, type NewFlag } from "./bench-flags-repo";
import { recordAudits, recordChanges, type ChangeInput } from "./bulk-log-repo";
import type { AuditInput } from "./audit";
import { gaugePastDue, round6, sameEvaluation, storedEvaluation, toRaw } from "./ingest-evaluate";
import { loadJobContext, type JobContext } from "./job-context";
import { currentReadings, findInstruments, jobReadings, lockJobs, updateEvaluation, type StoredReading } from "./readings-repo";

// The ONE mechanism that keeps a job's stored verdicts and flags in line with its readings and
// limits. Ingest calls it after writing readings; a limits edit calls it after changing job_limits.
//
// Inside the caller's transaction it: locks the job row; takes each station's current reading (the
// latest by takenAt that no other reading corrects; skipped entries carry no value and are passed
// over); re-evaluates it with lib/domain and stores the verdict when it changed; derives taper,
// out-of-round, clearances and stretch; then makes the flags match:
//   - a value (raw or derived) that is out_of_spec, marginal, or read with a gauge past its due date
//     (raw only) gets one flag, unless an open or disposed flag for that same value exists;
//   - an open or disposed flag is closed when its value is no longer current (a newer reading at the
//     station, or the derived value changed) or no longer needs attention (in spec after a limits
//     edit). closedByReadingId names the newer reading. A still-bad newer value gets a new flag, so
//     each value gets its own decision; the disposition history stays with the closed flag.
//   - a flag whose value stands but whose verdict or limits moved (a limits edit) is updated in place.
// Every change writes audit events and sync_changes rows. Flag reason priority for a raw reading:
// out_of_spec, then gauge_past_due, then marginal.

export type ReconcileOptions = {
  shopId: number;
  jobId: number;
  /** Who caused it (audit); null for the system. */
  userId: number | null;
  deviceId?: string | null;
  /** Why, for the audit trail: e.g. 'sync', 'limits-edit', 'gauge-edit'. */
  cause: string;
  /** Readings written in this same transaction: their creation is audited by the caller, not as a re-evaluation. */
  fresh?: ReadonlySet<string>;
};
export type ReconcileResult = {
  /** The stored evaluation of every current reading, after reconciliation. */
  evaluations: Map<string, ReadingEvaluation>;
  opened: number[];
  closed: number[];
  updatedFlags: number[];
  reevaluated: string[];
};

type Wanted = NewFlag;
type Closer = { id: string | null; value: number | null };
type Log = { audits: AuditInput[]; changes: ChangeInput[] };

function evaluateCurrent(ctx: JobContext, current: StoredReading[], raws: RawReading[], past: boolean[]) {
  return current.map((r, i) => {
    try {
      return storedEvaluation(evaluateReading(raws[i], ctx.shape, ctx.spec, raws), r.unit, past[i]);
    } catch {
      // A station the engine no longer has (an edited engine): no verdict, nothing to flag.
      return storedEvaluation(null, r.unit, past[i]);
    }
  });
}

function rawReason(e: ReadingEvaluation): NewFlag["reason"] | null {
  if (e.verdict === "out_of_spec") return "out_of_spec";
  if (e.verdictNote === "gauge_past_due") return "gauge_past_due";
  return e.verdict === "marginal" ? "marginal" : null;
}

function wantedRaw(shopId: number, jobId: number, r: StoredReading, e: ReadingEvaluation): Wanted | null {
  const reason = rawReason(e);
  if (!reason) return null;
  return {
    shopId, jobId, readingId: r.id, derivedKey: null, stationId: r.stationId, characteristic: r.characteristic,
    value: r.value as number, unit: r.unit, limitMin: e.limitMin, limitMax: e.limitMax, deviation: e.deviation,
    verdict: e.verdict ?? "in_spec", reason,
  };
}

function wantedDerived(shopId: number, jobId: number, d: DerivedValue): Wanted | null {
  if (d.verdict !== "out_of_spec" && d.verdict !== "marginal") return null;
  if (d.value === undefined) return null;
  return {
    shopId, jobId, readingId: null, derivedKey: d.key, stationId: d.stationId, characteristic: d.characteristic,
    value: round6(d.value) as number, unit: d.unit, limitMin: round6(d.limits?.min), limitMax: round6(d.limits?.max),
    deviation: round6(d.deviation), verdict: d.verdict, reason: d.verdict,
  };
}

function flagPatch(f: FlagRow, w: Wanted): FlagPatch | null {
  const patch: FlagPatch = {};
  if (f.verdict !== w.verdict) patch.verdict = w.verdict;
  if (f.reason !== w.reason) patch.reason = w.reason;
  for (const k of ["limitMin", "limitMax", "deviation"] as const) if (round6(f[k]) !== round6(w[k])) patch[k] = w[k];
  return Object.keys(patch).length ? patch : null;
}

/** Newest input reading of a derived value (by takenAt), which is what closes its old flag. */
function newestInput(d: DerivedValue, byStation: Map<string, StoredReading>): string | null {
  const inputs = d.inputs.map((s) => byStation.get(s)).filter((r): r is StoredReading => !!r);
  inputs.sort((a, b) => a.takenAt.getTime() - b.takenAt.getTime());
  return inputs.at(-1)?.id ?? null;
}

async function storeEvaluations(t: Transaction, o: ReconcileOptions, current: StoredReading[], evals: ReadingEvaluation[], log: Log) {
  const changed: string[] = [];
  for (const [i, r] of current.entries()) {
    const { unit: _u, ...e } = evals[i];
    if (sameEvaluation(r, e)) continue;
    await updateEvaluation(t, r.id, e);
    if (o.fresh?.has(r.id)) continue;
    changed.push(r.id);
    const before = { verdict: r.verdict, verdictNote: r.verdictNote, limitMin: r.limitMin, limitMax: r.limitMax, deviation: r.deviation };
    log.audits.push({ shopId: o.shopId, userId: o.userId, action: "reading.re-evaluate", entityType: "reading", entityId: r.id, before, after: { ...e, cause: o.cause } });
    log.changes.push({ shopId: o.shopId, jobId: o.jobId, entity: "reading", entityId: r.id, deviceId: o.deviceId });
  }
  return changed;
}

/**
 * `wanted`: the flags the values call for, keyed "r:<readingId>" or "d:<derivedKey>".
 * `closers`: the reading that replaces a value, keyed "s:<stationId>" (raw) or "d:<derivedKey>",
 * with the value now standing there (a flag on an unchanged value was closed by a limits edit).
 */
async function syncFlags(t: Transaction, o: ReconcileOptions, wanted: Map<string, Wanted>, closers: Map<string, Closer>, log: Log) {
  const out = { opened: [] as number[], closed: [] as number[], updatedFlags: [] as number[] };
  const flagLog = (id: number, action: string, before: unknown, after: unknown) => {
    log.audits.push({ shopId: o.shopId, userId: o.userId, action, entityType: "flag", entityId: id, before, after: { ...(after as object), cause: o.cause } });
    log.changes.push({ shopId: o.shopId, jobId: o.jobId, entity: "flag", entityId: id, deviceId: o.deviceId });
  };
  for (const f of await unclosedFlags(t, o.jobId)) {
    const key = f.readingId ? `r:${f.readingId}` : `d:${f.derivedKey}`;
    const w = wanted.get(key);
    if (w && (f.readingId || round6(f.value) === w.value)) {
      wanted.delete(key);
      const patch = flagPatch(f, w);
      if (!patch) continue;
      await updateFlag(t, f.id, patch);
      out.updatedFlags.push(f.id);
      flagLog(f.id, "flag.re-evaluate", { verdict: f.verdict, reason: f.reason, limitMin: f.limitMin, limitMax: f.limitMax, deviation: f.deviation }, patch);
      continue;
    }
    const closer = closers.get(f.readingId ? `s:${f.stationId}` : `d:${f.derivedKey}`);
    const sameValue = f.readingId ? closer?.id === f.readingId : closer?.value === round6(f.value);
    const closedByReadingId = !closer || sameValue ? null : closer.id;
    await updateFlag(t, f.id, { state: "closed", closedAt: new Date(), closedByReadingId });
    out.closed.push(f.id);
    flagLog(f.id, "flag.close", { state: f.state, disposition: f.disposition }, { state: "closed", closedByReadingId });
  }
  const created = await createFlags(t, [...wanted.values()]);
  for (const f of created) {
    out.opened.push(f.id);
    flagLog(f.id, "flag.open", null, { stationId: f.stationId, derivedKey: f.derivedKey, readingId: f.readingId, value: f.value, unit: f.unit, verdict: f.verdict, reason: f.reason });
  }
  return out;
}

export async function reconcileJob(t: Transaction, o: ReconcileOptions): Promise<ReconcileResult> {
  await lockJobs(t, o.shopId, [o.jobId]);
  const ctx = await loadJobContext(o.shopId, o.jobId, t);
  const current = currentReadings(await jobReadings(t, o.jobId));
  const instruments = await findInstruments(t, o.shopId, current.flatMap((r) => (r.instrumentId ? [r.instrumentId] : [])));
  const inst = (r: StoredReading) => (r.instrumentId ? instruments.get(r.instrumentId) : undefined);
  const raws = current.map((r) => toRaw(r, inst(r)));
  const past = current.map((r) => gaugePastDue(inst(r), r.takenAt));
  const evals = evaluateCurrent(ctx, current, raws, past);
  const log: Log = { audits: [], changes: [] };
  const reevaluated = await storeEvaluations(t, o, current, evals, log);

  const wanted = new Map<string, Wanted>();
  const byStation = new Map(current.map((r) => [r.stationId, r]));
  const closers = new Map<string, Closer>(current.map((r) => [`s:${r.stationId}`, { id: r.id, value: r.value }]));
  current.forEach((r, i) => {
    const w = wantedRaw(o.shopId, o.jobId, r, evals[i]);
    if (w) wanted.set(`r:${r.id}`, w);
  });
  let derived: DerivedValue[] = [];
  try {
    derived = deriveReadings(raws, ctx.shape, ctx.spec);
  } catch {
    derived = []; // an engine shape the core refuses has no derived values to flag
  }
  for (const d of derived) {
    closers.set(`d:${d.key}`, { id: newestInput(d, byStation), value: round6(d.value) });
    const w = wantedDerived(o.shopId, o.jobId, d);
    if (w) wanted.set(`d:${d.key}`, w);
  }
  const flags = await syncFlags(t, o, wanted, closers, log);
  await recordAudits(t, log.audits);
  await recordChanges(t, log.changes);
  return { evaluations: new Map(current.map((r, i) => [r.id, evals[i]])), reevaluated, ...flags };
}
