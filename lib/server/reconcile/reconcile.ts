import "server-only";
import type { Transaction } from "sequelize";
import { currentValues, evaluateReadings, type RawReading } from "@/lib/domain";
import type { ReadingEvaluation } from "@/lib/schemas/sync";
import type { AuditInput } from "@/lib/server/log/repo";
import { createFlags, unclosedFlags, updateFlag, type NewFlag, type UnclosedFlag } from "@/lib/server/reconcile/repo";
import { recordAudits } from "@/lib/server/log/repo";
import { recordChanges, type ChangeInput } from "@/lib/server/sync/repo";
import { newestInput, planFlags, wantedDerived, wantedRaw, type Closer } from "@/lib/server/reconcile/plan";
import { derivedScope, ingestStations, toJudge } from "@/lib/server/reconcile/scope";
import {
  gaugePastDue,
  round6,
  sameEvaluation,
  storedEvaluation,
  toRaw,
  type InstrumentInfo,
} from "@/lib/server/sync/ingest-evaluate";
import type { JobContext } from "@/lib/server/jobs/context";
import { loadJobContext } from "@/lib/server/jobs/repo";
import { jobReadingsWithGauges, lockJobs, updateEvaluation } from "@/lib/server/readings/repo";
import type { StoredReading } from "@/lib/schemas/readings";
import { settleAll } from "@/lib/server/core/sql-driver";

// The ONE mechanism that keeps a job's stored verdicts and flags in line with its readings and
// limits. Ingest calls it after writing readings; a limits edit calls it after changing job_limits.
//
// Inside the caller's transaction it: locks the job row; takes each station's current value (the
// shared rule, lib/domain/current-reading.ts: a station whose current reading is a skip has none);
// re-evaluates it with lib/domain and stores the verdict when it changed; derives taper,
// out-of-round, clearances and stretch; then makes the flags match (plan.ts). With
// `fresh` (ingest) it reads, judges and revisits only what the new readings can change
// (scope.ts); without it, everything:
//   - a value (raw or derived) that is out_of_spec, marginal, or read with a gauge past its due date
//     (raw only) gets one flag, unless an open or disposed flag for that same value exists;
//   - an open or disposed flag is closed when its value is no longer current (a newer reading at the
//     station, or the derived value changed) or no longer needs attention (in spec after a limits
//     edit). closedByReadingId names the newer reading. A still-bad newer value gets a new flag, so
//     each value gets its own decision; the disposition history stays with the closed flag;
//   - a flag whose value stands but whose verdict or limits moved (a limits edit) is updated in place.
// Every change writes audit events and sync_changes rows.

export type ReconcileOptions = {
  shopId: number;
  jobId: number;
  /** Who caused it (audit); null for the system. */
  userId: number | null;
  deviceId?: string | null;
  /** Why, for the audit trail: e.g. 'sync', 'limits-edit', 'gauge-edit'. */
  cause: string;
  /**
   * Readings written in this same transaction (ingest), id → station, already judged and stored with
   * their verdict. Their creation is audited by the caller, and only ring gaps whose bore they change
   * are judged again: every other current reading was judged against these same limits when it
   * arrived or at the last reconciliation.
   * Leave it out to re-evaluate everything (after a limits or gauge edit).
   */
  fresh?: ReadonlyMap<string, string>;
  /** The job's context loaded in this transaction with the job row already locked (saves queries). */
  context?: JobContext;
  /** Collects audit and change rows for the caller to write with its own, instead of writing them here. */
  log?: ReconcileLog;
  /** The shop's gauges, already read in this transaction (ingest's); else they are read with the readings. */
  gauges?: Map<number, InstrumentInfo>;
};
export type ReconcileLog = { audits: AuditInput[]; changes: ChangeInput[] };
export type ReconcileResult = {
  /** The stored evaluation of every current reading read, after reconciliation. */
  evaluations: Map<string, ReadingEvaluation>;
  opened: number[];
  closed: number[];
  updatedFlags: number[];
  reevaluated: string[];
  /** Stations whose current reading's verdict changed (fresh readings aside). */
  verdictChangedStations: string[];
};
/** What a reconciliation reads: the readings in scope with their gauges, and the unclosed flags in scope. */
export type ReconcileInput = Awaited<ReturnType<typeof jobReadingsWithGauges>> & { flags: UnclosedFlag[] };

const storedOf = (r: StoredReading): ReadingEvaluation => ({
  verdict: r.verdict,
  verdictNote: r.verdictNote,
  unit: r.unit,
  limitMin: r.limitMin,
  limitMax: r.limitMax,
  deviation: r.deviation,
});

function evaluateCurrent(
  ctx: JobContext,
  current: StoredReading[],
  raws: RawReading[],
  past: boolean[],
  judge: (r: StoredReading) => boolean,
  gaugeOf: (r: StoredReading) => InstrumentInfo | undefined,
) {
  // One current reading per station (currentValues), so the batch's answers are by station.
  const judging = new Set(current.filter(judge).map((r) => r.stationId));
  const judged = evaluateReadings(raws, ctx.shape, ctx.spec, { only: (s) => judging.has(s) });
  return current.map((r, i) => {
    if (!judge(r)) return storedOf(r);
    const ev = judged.get(r.stationId);
    try {
      if (typeof ev === "object")
        return storedEvaluation(ev, r.unit, past[i], { inst: gaugeOf(r), takenAt: r.takenAt });
    } catch {
      // Stored as a figure the core refuses, as below.
    }
    // Words instead (a station the engine no longer has, an edited engine): no verdict, nothing to flag.
    return storedEvaluation(null, r.unit, past[i]);
  });
}

// Writes here are awaited one by one, never pipelined behind another write: if a statement dies in
// a deadlock, InnoDB rolls the transaction back and a write already queued behind it would run
// (and commit) on its own. Reads may follow a write in a pipeline (sql-driver.ts).

/** Stores changed evaluations; returns the re-evaluated ids that were not fresh, and where the verdict moved. */
async function storeEvaluations(
  t: Transaction,
  o: ReconcileOptions,
  current: StoredReading[],
  evals: ReadingEvaluation[],
  log: ReconcileLog,
) {
  const changed: string[] = [];
  const verdictMoved: string[] = [];
  for (const [i, r] of current.entries()) {
    const { unit: _u, ...e } = evals[i];
    if (sameEvaluation(r, e)) continue;
    await updateEvaluation(t, r.id, e);
    if (o.fresh?.has(r.id)) continue;
    changed.push(r.id);
    if (r.verdict !== e.verdict) verdictMoved.push(r.stationId);
    const before = {
      verdict: r.verdict,
      verdictNote: r.verdictNote,
      limitMin: r.limitMin,
      limitMax: r.limitMax,
      deviation: r.deviation,
    };
    log.audits.push({
      shopId: o.shopId,
      userId: o.userId,
      action: "reading.re-evaluate",
      entityType: "reading",
      entityId: r.id,
      before,
      after: { ...e, cause: o.cause },
    });
    log.changes.push({ shopId: o.shopId, jobId: o.jobId, entity: "reading", entityId: r.id, deviceId: o.deviceId });
  }
  return { changed, verdictMoved };
}

async function syncFlags(
  t: Transaction,
  o: ReconcileOptions,
  flags: UnclosedFlag[],
  wanted: Map<string, NewFlag>,
  closers: Map<string, Closer>,
  log: ReconcileLog,
) {
  const plan = planFlags(flags, wanted, closers);
  const note = (id: number, action: string, before: unknown, after: object) => {
    log.audits.push({
      shopId: o.shopId,
      userId: o.userId,
      action,
      entityType: "flag",
      entityId: id,
      before,
      after: { ...after, cause: o.cause },
    });
    log.changes.push({ shopId: o.shopId, jobId: o.jobId, entity: "flag", entityId: id, deviceId: o.deviceId });
  };
  for (const { flag: f, patch } of plan.update) {
    await updateFlag(t, f.id, patch);
    note(
      f.id,
      "flag.re-evaluate",
      { verdict: f.verdict, reason: f.reason, limitMin: f.limitMin, limitMax: f.limitMax, deviation: f.deviation },
      patch,
    );
  }
  for (const { flag: f, closedByReadingId } of plan.close) {
    await updateFlag(t, f.id, { state: "closed", closedAt: new Date(), closedByReadingId });
    note(f.id, "flag.close", { state: f.state, disposition: f.disposition }, { state: "closed", closedByReadingId });
  }
  const ids = await createFlags(t, plan.open);
  plan.open.forEach((f, i) =>
    note(ids[i], "flag.open", null, {
      stationId: f.stationId,
      derivedKey: f.derivedKey,
      readingId: f.readingId,
      value: f.value,
      unit: f.unit,
      verdict: f.verdict,
      reason: f.reason,
    }),
  );
  return { opened: ids, closed: plan.close.map((c) => c.flag.id), updatedFlags: plan.update.map((u) => u.flag.id) };
}

/**
 * Issues the reads of a reconciliation (readings in scope with their gauges, unclosed flags) without
 * waiting between them. `context` must be the job's, loaded with the job row locked.
 */
export function readForReconcile(t: Transaction, o: ReconcileOptions, ctx: JobContext): Promise<ReconcileInput> {
  // With a context the caller locked the job before its first read, so its snapshot is fresh.
  const locking = !o.context;
  const stations = o.fresh ? ingestStations(ctx, new Set(o.fresh.values())) : undefined;
  const inScope = stations ? new Set(stations) : undefined;
  const reading = jobReadingsWithGauges(t, o.shopId, o.jobId, { locking, stations, gauges: o.gauges });
  // Raw flags outside the scope keep whatever they are (derived ones are filtered once derived).
  const flags = unclosedFlags(t, o.jobId, locking).then((fs) =>
    inScope ? fs.filter((f) => !!f.derivedKey || inScope.has(f.stationId)) : fs,
  );
  return settleAll([reading, flags]).then(([r, f]) => ({ ...r, flags: f }));
}

export async function reconcileJob(
  t: Transaction,
  o: ReconcileOptions,
  input?: Promise<ReconcileInput>,
): Promise<ReconcileResult> {
  let ctx = o.context;
  if (!ctx) {
    await lockJobs(t, o.shopId, [o.jobId]);
    ctx = await loadJobContext(o.shopId, o.jobId, t);
  }
  const { readings, instruments, flags } = await (input ?? readForReconcile(t, o, ctx));
  const current = currentValues(readings);
  const inst = (r: StoredReading) => (r.instrumentId ? instruments.get(r.instrumentId) : undefined);
  const raws = current.map((r) => toRaw(r, inst(r)));
  // Past due is a fact of the moment of measurement: once stored, a later recalibration of the
  // gauge (a new due date) must not clear it.
  const past = current.map((r) => r.verdictNote === "gauge_past_due" || gaugePastDue(inst(r), r.takenAt));
  const evals = evaluateCurrent(ctx, current, raws, past, toJudge(ctx, o.fresh), inst);
  const log: ReconcileLog = o.log ?? { audits: [], changes: [] };
  const { changed: reevaluated, verdictMoved } = await storeEvaluations(t, o, current, evals, log);

  const wanted = new Map<string, NewFlag>();
  const byStation = new Map(current.map((r) => [r.stationId, r]));
  const closers = new Map<string, Closer>(current.map((r) => [`s:${r.stationId}`, { id: r.id, value: r.value }]));
  current.forEach((r, i) => {
    const w = wantedRaw(r, evals[i]);
    if (w) wanted.set(`r:${r.id}`, w);
  });
  const { derived, inScope } = derivedScope(ctx, current, raws, o.fresh);
  for (const d of derived) {
    closers.set(`d:${d.key}`, { id: newestInput(d, byStation), value: round6(d.value) });
    const w = wantedDerived(o.shopId, o.jobId, d);
    if (w) wanted.set(`d:${d.key}`, w);
  }
  // Derived flags outside the scope of this reconciliation keep whatever they are.
  const result = await syncFlags(
    t,
    o,
    flags.filter((f) => !f.derivedKey || inScope(f.derivedKey)),
    wanted,
    closers,
    log,
  );
  if (!o.log) {
    await recordAudits(t, log.audits);
    await recordChanges(t, log.changes);
  }
  const evaluations = new Map(current.map((r, i) => [r.id, evals[i]]));
  return { evaluations, reevaluated, verdictChangedStations: verdictMoved, ...result };
}
