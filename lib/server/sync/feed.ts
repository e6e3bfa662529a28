import "server-only";
import { deriveReadings } from "@/lib/domain";
import { SETTLE_MS, type SyncFeed } from "@/lib/schemas/sync";
import { toBenchFlag } from "@/lib/server/bench/flag-view";
import { flagsOfJobs, jobHeaders } from "@/lib/server/bench/repo";
import { loadJobContext } from "@/lib/server/jobs/repo";
import { correctionsOf, readingsOfJobs, toServerReading } from "@/lib/server/readings/repo";
import { CHANGE_PAGE, changesSince, ownedJobIds, type ChangeRow } from "@/lib/server/sync/repo";

// GET /api/sync: the change feed (sync_changes) turned into the current state of what changed.
//
// The cursor is a sync_changes id. Ids are handed out when a row is inserted, but rows become
// visible when their transaction commits, so a lower id can appear after a higher one. The cursor
// therefore only moves over rows older than SETTLE_MS (no sync transaction stays open that long
// after writing its change rows); newer rows are sent as well but sent again next time, and the
// tablet upserts by id. A change is never skipped, at the cost of a small overlap.

/** Moves over the settled prefix of the rows only (see the top of this file). */
function advance(since: string, rows: ChangeRow[]): string {
  const horizon = Date.now() - SETTLE_MS;
  let cursor = since;
  for (const r of rows) {
    if (new Date(r.createdAt).getTime() >= horizon) break;
    cursor = String(r.id);
  }
  return cursor;
}

/** Derived key → input stations, per job, so a derived flag can mark what to measure again. */
export async function derivedInputs(shopId: number, jobIds: number[]): Promise<Map<number, Map<string, string[]>>> {
  const out = new Map<number, Map<string, string[]>>();
  for (const jobId of jobIds) {
    const ctx = await loadJobContext(shopId, jobId);
    out.set(jobId, new Map());
    try {
      for (const d of deriveReadings([], ctx.shape, ctx.spec)) out.get(jobId)!.set(d.key, d.inputs);
    } catch {
      // An engine the core refuses has no derived values; its flags mark their own station.
    }
  }
  return out;
}

async function changedState(shopId: number, jobIds: number[], rows: ChangeRow[]) {
  const ids = (entity: string) => [...new Set(rows.filter((r) => r.entity === entity).map((r) => r.entityId))];
  const readingIds = ids("reading");
  const flagIds = ids("flag").map(Number);
  const limitJobs = [...new Set(rows.filter((r) => r.entity === "job_limits").map((r) => Number(r.jobId)))];
  const [readings, corrections, flags] = await Promise.all([
    readingsOfJobs(jobIds, readingIds),
    correctionsOf(readingIds),
    flagsOfJobs(jobIds, { ids: flagIds }),
  ]);
  const inputs = await derivedInputs(shopId, [...new Set(flags.filter((f) => f.derivedKey).map((f) => f.jobId))]);
  const limits = [];
  for (const jobId of limitJobs) {
    const ctx = await loadJobContext(shopId, jobId);
    limits.push({ jobId, specRevision: ctx.job.specRevision, spec: ctx.spec });
  }
  return {
    readings: readings.map((r) => toServerReading(r, corrections.get(r.id) ?? null)),
    flags: flags.map((f) => toBenchFlag(f, inputs.get(f.jobId) ?? new Map())),
    limits,
  };
}

export async function syncFeed(shopId: number, since: string, jobIds: number[]): Promise<SyncFeed> {
  const owned = await ownedJobIds(shopId, jobIds);
  const missing = jobIds.filter((id) => !owned.includes(id));
  if (owned.length === 0) return { cursor: since, more: false, jobs: [], limits: [], readings: [], flags: [], missing };
  const rows = await changesSince(owned, since);
  const cursor = advance(since, rows);
  // Read after the change rows, so the state is at least as new as every row listed.
  const [jobs, state] = await Promise.all([jobHeaders(shopId, owned), changedState(shopId, owned, rows)]);
  return { cursor, more: rows.length === CHANGE_PAGE && cursor !== since, jobs, ...state, missing };
}
