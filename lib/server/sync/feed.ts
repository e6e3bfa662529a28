import "server-only";
import type { SyncFeed } from "@/lib/schemas/sync";
import { recipeInputs, toBenchFlag } from "@/lib/server/bench/flag-view";
import { flagsOfJobs, toHeader } from "@/lib/server/bench/repo";
import { toEngineShape } from "@/lib/server/jobs/context";
import { jobSpecs, jobsWithEngines } from "@/lib/server/jobs/repo";
import { correctionsOf, readingsOfJobs } from "@/lib/server/readings/repo";
import { toServerReading } from "@/lib/server/readings/server-reading";
import { CHANGE_PAGE, changesSince, type ChangeRow } from "@/lib/server/sync/repo";

// GET /api/sync: the change feed (sync_changes) turned into the current state of what changed.
//
// The cursor is the shop's change sequence number (seq) of the last row sent. Numbers follow commit
// order and every database node shows a gap-free prefix of them (migrations/20261204020000), so
// "rows numbered after the cursor" never skips a change that commits late, on this node or through
// another, and never sends one twice: no settle window, whatever the replication lag. A node that
// lags only answers with fewer rows; the next call brings the rest.
// Cursors handed out before (sync_changes ids) are seq numbers too: old rows kept seq = id.
//
// One round trip for the change rows (only the shop's jobs: another shop's ids find none), then one
// of queries side by side for the state they name: every id read there comes from a change row of
// the shop. The derived flags' input stations come from the core's recipes of the engine's shape.

async function changedState(jobIds: number[], rows: ChangeRow[]) {
  const ids = (entity: string) => [...new Set(rows.filter((r) => r.entity === entity).map((r) => r.entityId))];
  const readingIds = ids("reading");
  const limitJobs = [...new Set(rows.filter((r) => r.entity === "job_limits").map((r) => Number(r.jobId)))];
  const [readings, corrections, flags, specs] = await Promise.all([
    readingsOfJobs(jobIds, readingIds),
    correctionsOf(jobIds, readingIds),
    flagsOfJobs(jobIds, { ids: ids("flag").map(Number) }),
    jobSpecs(limitJobs),
  ]);
  return { readings, corrections, flags, specs };
}

export async function syncFeed(shopId: number, since: string, jobIds: number[]): Promise<SyncFeed> {
  const rows = await changesSince(shopId, jobIds, since);
  const cursor = rows.length ? String(rows.at(-1)!.seq) : since;
  // Read after the change rows, so the state is at least as new as every row listed.
  const [owned, state] = await Promise.all([jobsWithEngines(shopId, jobIds), changedState(jobIds, rows)]);
  const byId = new Map(owned.map((o) => [o.job.id, o]));
  const inputsOf = (jobId: number) => {
    const o = byId.get(jobId);
    return o?.engine ? recipeInputs(toEngineShape(o.engine, o.job)) : new Map();
  };
  return {
    cursor,
    more: rows.length === CHANGE_PAGE,
    jobs: owned.map((o) => toHeader(o.job)),
    limits: [...state.specs].flatMap(([jobId, spec]) => {
      const o = byId.get(jobId);
      return o ? [{ jobId, specRevision: o.job.specRevision, spec }] : [];
    }),
    readings: state.readings.map((r) => toServerReading(r, state.corrections.get(r.id) ?? null)),
    flags: state.flags.map((f) => toBenchFlag(f, f.derivedKey ? inputsOf(f.jobId) : new Map())),
    missing: jobIds.filter((id) => !byId.has(id)),
  };
}
