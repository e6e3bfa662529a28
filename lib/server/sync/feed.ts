import "server-only";
import { deriveReadings } from "@/lib/domain";
import type { SyncFeed } from "@/lib/schemas/sync";
import { toBenchFlag } from "@/lib/server/bench/flag-view";
import { flagsOfJobs, jobHeaders } from "@/lib/server/bench/repo";
import { loadJobContext } from "@/lib/server/jobs/repo";
import { correctionsOf, readingsOfJobs, toServerReading } from "@/lib/server/readings/repo";
import { CHANGE_PAGE, changesSince, ownedJobIds, type ChangeRow } from "@/lib/server/sync/repo";

// GET /api/sync: the change feed (sync_changes) turned into the current state of what changed.
//
// The cursor is the shop's change sequence number (seq) of the last row sent. Numbers follow commit
// order and every database node shows a gap-free prefix of them (migrations/20261204020000), so
// "rows numbered after the cursor" never skips a change that commits late, on this node or through
// another, and never sends one twice: no settle window, whatever the replication lag. A node that
// lags only answers with fewer rows; the next call brings the rest.
// Cursors handed out before (sync_changes ids) are seq numbers too: old rows kept seq = id.

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
  const cursor = rows.length ? String(rows.at(-1)!.seq) : since;
  // Read after the change rows, so the state is at least as new as every row listed.
  const [jobs, state] = await Promise.all([jobHeaders(shopId, owned), changedState(shopId, owned, rows)]);
  return { cursor, more: rows.length === CHANGE_PAGE, jobs, ...state, missing };
}
