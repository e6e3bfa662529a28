import "server-only";
import type { Transaction } from "sequelize";
import {
  MAX_BATCH,
  pushReadingSchema,
  type PushErrorReply,
  type PushReading,
  type PushReply,
  type PushResult,
  type ReadingEvaluation,
} from "@/lib/schemas/sync";
import type { FieldErrors } from "@/lib/schemas/errors";
import type { Actor } from "@/lib/schemas/session";
import { recordAudits } from "@/lib/server/log/repo";
import { recordChangesAndCommit } from "@/lib/server/sync/repo";
import { syncAudits } from "@/lib/server/sync/ingest-audit";
import { getSequelize } from "@/lib/server/core/db";
import { AppError, fieldErrors } from "@/lib/server/core/errors";
import { readForReconcile, reconcileJob, type ReconcileLog } from "@/lib/server/reconcile/reconcile";
import { checkItem, type BatchContext, type Checked } from "@/lib/server/sync/ingest-check";
import { batchJobs, prefetchJobs } from "@/lib/server/sync/ingest-context";
import { withDeadlockRetry } from "@/lib/server/sync/ingest-retry";
import { findReadings, insertReadings, lockJobRevisions } from "@/lib/server/readings/repo";
import { batchInstruments } from "@/lib/server/readings/gauge-repo";
import type { StoredReading } from "@/lib/schemas/readings";
import { settleAll } from "@/lib/server/core/sql-driver";
import { lastChangeId } from "@/lib/server/sync/repo";

// POST /api/sync: one batch, one transaction, all or nothing (the rule is documented in
// lib/schemas/sync.ts). Steps: parse each item; lock the batch's jobs; check every item against
// its job, the gauges and what is stored; if any is refused, write nothing and say why per item;
// else insert the new readings in one statement, reconcile each job's verdicts and flags once,
// and log the batch: one audit event per job listing its new readings with their final verdicts
// (ingest-audit.ts), and one change-feed row per reading.

type Parsed = { index: number; item?: PushReading; id: string | null; errors?: FieldErrors };
/** null: the item failed the schema. duplicate: the same id earlier in the batch with the same figures. */
type Outcome = Checked | { kind: "duplicate"; of: number } | null;
export type IngestReply = { status: 200; body: PushReply } | { status: 409 | 422; body: PushErrorReply };

function parseItems(raw: unknown[]): Parsed[] {
  return raw.map((r, index) => {
    const parsed = pushReadingSchema.safeParse(r);
    const id =
      r && typeof r === "object" && typeof (r as { id?: unknown }).id === "string" ? (r as { id: string }).id : null;
    return parsed.success
      ? { index, item: parsed.data, id: parsed.data.id }
      : { index, id, errors: fieldErrors(parsed.error) };
  });
}

async function batchContext(
  t: Transaction,
  actor: Actor,
  deviceId: string,
  items: PushReading[],
): Promise<BatchContext> {
  const supersedes = items.flatMap((i) => (i.supersedes ? [i.supersedes] : []));
  // Issued together (one round trip). The lock runs first on the server, so the reads after it
  // (and this transaction's snapshot) already see every batch committed before we got the lock.
  const reads = settleAll([
    lockJobRevisions(
      t,
      actor.shopId,
      items.map((i) => i.jobId),
    ),
    batchInstruments(t, actor.shopId),
    // One lookup for both: ids already stored (replays, conflicts) and the readings corrected.
    findReadings(t, [...new Set([...items.map((i) => i.id), ...supersedes])]),
  ]);
  // Issued after those, so the context of a job never seen before is read with the lock held.
  const prefetched = prefetchJobs(
    t,
    actor.shopId,
    items.map((i) => i.jobId),
  );
  const [revisions, instruments, found] = await reads;
  // Keyed by the canonical (lower-case) id: a row stored before ids were made canonical is still found.
  const known = new Map([...found].map(([id, r]) => [id.toLowerCase(), r]));
  const jobs = await batchJobs(t, actor.shopId, revisions, prefetched);
  const existing = new Map(items.flatMap((i) => (known.has(i.id) ? [[i.id, known.get(i.id)!] as const] : [])));
  const targets = new Map<string, { shopId: number; jobId: number; stationId: string }>(
    supersedes.flatMap((id) => (known.has(id) ? [[id, known.get(id)!] as const] : [])),
  );
  for (const i of items)
    if (!targets.has(i.id) && supersedes.includes(i.id))
      targets.set(i.id, { shopId: actor.shopId, jobId: i.jobId, stationId: i.stationId });
  return {
    shopId: actor.shopId,
    userId: actor.userId,
    deviceId,
    now: new Date(),
    jobs,
    instruments,
    existing,
    targets,
  };
}

/** Checks every parsed item; a second copy of an id in the batch is the first one's replay or a conflict. */
function checkAll(parsed: Parsed[], bc: BatchContext): Outcome[] {
  const seen = new Map<string, number>();
  return parsed.map((p) => {
    if (!p.item) return null;
    const first = seen.get(p.item.id);
    if (first === undefined) {
      seen.set(p.item.id, p.index);
      return checkItem(p.item, bc);
    }
    const same = JSON.stringify(parsed[first].item) === JSON.stringify(p.item);
    const reason = `Reading ${p.item.id} appears twice in this batch with different figures; give the correction a new id`;
    return same
      ? { kind: "duplicate", of: first }
      : { kind: "rejected", code: "conflict", reason, errors: { id: [reason] } };
  });
}

/** New rows ordered so a correction follows the reading it corrects (the foreign key is checked row by row). */
function insertOrder(rows: StoredReading[]): StoredReading[] {
  const pending = new Map(rows.map((r) => [r.id, r]));
  const out: StoredReading[] = [];
  const visit = (r: StoredReading) => {
    if (!pending.delete(r.id)) return;
    const target = r.supersedes ? pending.get(r.supersedes) : undefined;
    if (target) visit(target);
    out.push(r);
  };
  for (const r of rows) visit(r);
  return out;
}

function evaluationOf(c: { row: StoredReading }, final: ReadingEvaluation | undefined): ReadingEvaluation {
  const r = c.row;
  return (
    final ?? {
      verdict: r.verdict,
      verdictNote: r.verdictNote,
      unit: r.unit,
      limitMin: r.limitMin,
      limitMax: r.limitMax,
      deviation: r.deviation,
    }
  );
}

/**
 * Inserts, reconciles each job once, and writes the audit events; returns final evaluations and
 * the change-feed rows, which the caller writes last (recordChanges says why).
 * The insert and every job's reconciliation reads are issued together (one round trip): the
 * server runs them in order, so the reads see the new rows. Only reads ever follow a write in a
 * pipeline: after a deadlock, a queued write would run outside the rolled-back transaction.
 */
async function write(t: Transaction, actor: Actor, bc: BatchContext, fresh: StoredReading[]) {
  const jobIds = [...new Set(fresh.map((r) => r.jobId))].sort((a, b) => a - b);
  const log: ReconcileLog = {
    audits: [],
    changes: fresh.map((r) => ({
      shopId: actor.shopId,
      jobId: r.jobId,
      entity: "reading" as const,
      entityId: r.id,
      deviceId: bc.deviceId,
    })),
  };
  const options = jobIds.map((jobId) => ({
    shopId: actor.shopId,
    jobId,
    userId: actor.userId,
    deviceId: bc.deviceId,
    cause: "sync",
    log,
    context: bc.jobs.get(jobId)!,
    gauges: bc.instruments,
    fresh: new Map(fresh.filter((r) => r.jobId === jobId).map((r) => [r.id, r.stationId])),
  }));
  const inserting = insertReadings(t, insertOrder(fresh));
  const inputs = options.map((o) => readForReconcile(t, o, o.context));
  await settleAll([inserting, ...inputs]);
  const finals = new Map<string, ReadingEvaluation>();
  for (const [i, o] of options.entries()) {
    const res = await reconcileJob(t, o, inputs[i]);
    for (const [id, e] of res.evaluations) if (o.fresh.has(id)) finals.set(id, e);
  }
  log.audits.unshift(...syncAudits(actor, bc.deviceId, fresh, finals));
  // One after the other: a write never waits in a pipeline behind another (reconcile/reconcile.ts says why).
  await recordAudits(t, log.audits);
  return { finals, changes: log.changes };
}

function results(
  parsed: Parsed[],
  checked: Outcome[],
  finals: Map<string, ReadingEvaluation>,
  refused: boolean,
): PushResult[] {
  const one = (p: Parsed, c: Outcome): PushResult => {
    if (!c)
      return {
        index: p.index,
        id: p.id,
        status: "rejected",
        code: "invalid",
        reason: Object.entries(p.errors ?? {})
          .map(([f, m]) => `${f}: ${m.join("; ")}`)
          .join(". "),
        errors: p.errors,
      };
    if (c.kind === "duplicate") return { ...one(parsed[c.of], checked[c.of]), index: p.index };
    if (c.kind === "rejected")
      return {
        index: p.index,
        id: p.id,
        status: "rejected",
        code: c.code,
        reason: c.reason,
        ...(c.errors ? { errors: c.errors } : {}),
      };
    if (c.kind === "replay") {
      const s = c.stored;
      return {
        index: p.index,
        id: s.id,
        status: "accepted",
        replay: true,
        verdict: s.verdict,
        evaluation: {
          verdict: s.verdict,
          verdictNote: s.verdictNote,
          unit: s.unit,
          limitMin: s.limitMin,
          limitMax: s.limitMax,
          deviation: s.deviation,
        },
      };
    }
    if (refused) return { index: p.index, id: c.row.id, status: "held" };
    const e = evaluationOf(c, finals.get(c.row.id));
    return { index: p.index, id: c.row.id, status: "accepted", replay: false, verdict: e.verdict, evaluation: e };
  };
  return parsed.map((p, i) => one(p, checked[i]));
}

function refusal(res: PushResult[], cursor: string): IngestReply {
  const rejected = res.filter((r): r is Extract<PushResult, { status: "rejected" }> => r.status === "rejected");
  const fields: FieldErrors = {};
  for (const r of rejected)
    for (const [f, m] of Object.entries(r.errors ?? { _: [r.reason] })) fields[`readings.${r.index}.${f}`] = m;
  const locked = rejected.every((r) => r.code === "job_locked");
  const message = locked
    ? `${rejected[0].reason} Nothing in this batch was saved; the readings stay on the tablet.`
    : `${rejected.length} of ${res.length} readings need fixing; nothing in this batch was saved. ` +
      "Fix those (see each reading's errors) or send the others without them.";
  return {
    status: locked ? 409 : 422,
    body: { error: { code: locked ? "job_locked" : "invalid", message, fields }, results: res, cursor },
  };
}

export async function ingestBatch(
  actor: Actor,
  batch: { deviceId: string; readings: unknown[] },
): Promise<IngestReply> {
  if (batch.readings.length > MAX_BATCH) {
    throw new AppError(
      "payload_too_large",
      `Send at most ${MAX_BATCH} readings per batch; this one has ${batch.readings.length}. Split it and send again.`,
    );
  }
  const parsed = parseItems(batch.readings);
  const items = parsed.flatMap((p) => (p.item ? [p.item] : []));
  return withDeadlockRetry(() =>
    getSequelize().transaction(async (t) => {
      const bc = await batchContext(t, actor, batch.deviceId, items);
      const checked = checkAll(parsed, bc);
      const bad = checked.some((c) => !c || c.kind === "rejected");
      const fresh = bad ? [] : checked.flatMap((c) => (c?.kind === "new" ? [c.row] : []));
      if (!fresh.length) {
        const res = results(parsed, checked, new Map(), bad);
        const cursor = await lastChangeId(t, [...bc.jobs.keys()]);
        return bad ? refusal(res, cursor) : { status: 200 as const, body: { results: res, cursor } };
      }
      const { finals, changes } = await write(t, actor, bc, fresh);
      const res = results(parsed, checked, finals, false);
      // The shop's feed counter is locked from here to the commit, which this same statement makes.
      return { status: 200 as const, body: { results: res, cursor: await recordChangesAndCommit(t, changes) } };
    }),
  );
}
