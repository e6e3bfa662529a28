import "server-only";
import type { Sequelize, Transaction } from "sequelize";
import { benchRoute, jobLockReason } from "@/lib/domain";
import { getSequelize } from "@/lib/server/core/db";
import type { BatchJob } from "@/lib/server/sync/ingest-check";
import type { JobContext } from "@/lib/server/jobs/context";
import { loadJobContext } from "@/lib/server/jobs/repo";

// Each job's context as POST /api/sync judges readings with it (job, engine shape, limits, route
// station ids, lock reason), kept in memory between batches. A tablet sends a job's readings in
// many batches, and loading the context is most of a small batch's queries.
//
// An entry is used only while the job's context_revision, read under the job's row lock in this
// same transaction, equals the one it was loaded under. The database changes that token on every
// change of the job row, its engine or its limits (triggers: migrations/20261202000200), and no
// such change can commit while we hold the lock; so a cached context is always the one the
// database would give now, and stale limits never judge a reading. On a Galera cluster the lock
// holds on this node only and an edit may have committed through another node a moment ago: the
// token is therefore read causally (lockJobRevisions, core/cluster.ts), after this node has applied
// every commit the cluster had made, so an edit through any instance is seen by the next batch.
// An edit committing through another node while the batch runs cannot slip past it either: both
// end by numbering their changes in the shop's change sequence (sync/repo.ts), so one of them fails
// at commit (1213) and runs again, after the other, as on one database.

type Entry = { shopId: number; revision: string; job: BatchJob };

const MAX_ENTRIES = 500;
// Per Sequelize instance, so a process that reconnects (tests) never mixes two databases' jobs.
const caches = new WeakMap<Sequelize, Map<number, Entry>>();

function cacheOf(): Map<number, Entry> {
  const sequelize = getSequelize();
  let cache = caches.get(sequelize);
  if (!cache) caches.set(sequelize, (cache = new Map()));
  return cache;
}

// Station ids per engine shape, by its JSON (jobs on the same kind of engine share one set).
const routes = new Map<string, Set<string>>();
function routeIdsOf(shape: BatchJob["shape"]): Set<string> {
  const key = JSON.stringify(shape);
  let ids = routes.get(key);
  if (!ids) {
    if (routes.size >= 100) routes.clear();
    routes.set(key, (ids = new Set(benchRoute(shape).sections.flatMap((s) => s.stations.map((st) => st.id)))));
  }
  return ids;
}

/**
 * The contexts of these locked jobs (`revisions`: id → context_revision, from lockJobRevisions in
 * this transaction): from the cache when the token matches, else loaded now and remembered.
 */
export async function batchJobs(
  t: Transaction,
  shopId: number,
  revisions: Map<number, string>,
  prefetched = new Map<number, Promise<JobContext | null>>(),
): Promise<Map<number, BatchJob>> {
  const cache = cacheOf();
  const jobs = new Map<number, BatchJob>();
  for (const [id, revision] of revisions) {
    const hit = cache.get(id);
    if (hit && hit.revision === revision && hit.shopId === shopId) {
      jobs.set(id, hit.job);
      continue;
    }
    const ctx = (await prefetched.get(id)) ?? (await loadJobContext(shopId, id, t));
    const job: BatchJob = { ...ctx, routeIds: routeIdsOf(ctx.shape), lockReason: jobLockReason(ctx.job) };
    if (cache.size >= MAX_ENTRIES) cache.clear();
    cache.set(id, { shopId, revision, job });
    jobs.set(id, job);
  }
  return jobs;
}

/**
 * Starts loading the context of each job the cache has no entry for, to be issued right after the
 * job lock in the same pipeline (so it reads after the lock, in the same snapshot): a tablet's first
 * batch for a job then costs no extra round trip. A failure here only means batchJobs loads again.
 */
export function prefetchJobs(
  t: Transaction,
  shopId: number,
  jobIds: number[],
): Map<number, Promise<JobContext | null>> {
  const cache = cacheOf();
  const unseen = [...new Set(jobIds)].filter((id) => !cache.has(id));
  return new Map(unseen.map((id) => [id, loadJobContext(shopId, id, t).catch(() => null)]));
}
