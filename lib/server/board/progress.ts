import "server-only";
import { progressOfJobs, type Progress } from "@/lib/server/jobs/readings";
import { isRetryable } from "@/lib/server/sync/ingest-retry";
import { jobsWithEngines } from "@/lib/server/jobs/repo";
import { keptProgress, progressTokens, staleProgressJobs, storeProgress } from "@/lib/server/board/repo";

// Kept progress counts (table job_progress): counted by lib/domain/progress.ts, through the same
// function the job page uses, and stored with the revision tokens they were counted at. Only stale
// jobs are counted: after the first look, a request counts the few jobs whose readings, limits or
// engine changed since, reading only those jobs' readings (a chunk at a time, so memory stays small).

const CHUNK = 50;

/** Counts these jobs again and keeps the result; answers the figures counted (null: no engine). */
export async function countProgress(shopId: number, jobIds: number[]): Promise<Map<number, Progress | null>> {
  const out = new Map<number, Progress | null>();
  for (let i = 0; i < jobIds.length; i += CHUNK) {
    const ids = jobIds.slice(i, i + CHUNK);
    // The tokens first: a reading that lands after this moves the token, and the count stays stale.
    const tokens = await progressTokens(shopId, ids);
    const jobs = await jobsWithEngines(shopId, ids);
    const counted = await progressOfJobs(
      shopId,
      jobs.map(({ job, engine }) => ({ ...job, engine })),
    );
    const rows = tokens.map((t) => {
      const p = counted.get(Number(t.jobId)) ?? null;
      out.set(Number(t.jobId), p);
      return { ...t, jobId: Number(t.jobId), required: p?.required ?? null, done: p?.done ?? null };
    });
    // Keeping the counts is a convenience: when it collides with a sync writing the same rows (a
    // deadlock, or a certification conflict on a cluster) the counts still answer this request and
    // stay stale, to be counted again by the next.
    await storeProgress(rows).catch((err: unknown) => {
      if (!isRetryable(err)) throw err;
    });
  }
  return out;
}

/** Brings every stale count of the shop's jobs in `statuses` up to date (before sorting by progress). */
export async function refreshProgress(shopId: number, statuses: readonly string[]): Promise<void> {
  const stale = await staleProgressJobs(shopId, statuses);
  if (stale.length) await countProgress(shopId, stale);
}

/** Progress of these jobs of the shop from the kept counts, counting again only the stale ones. */
export async function progressOf(shopId: number, jobIds: number[]): Promise<Map<number, Progress | null>> {
  const kept = await keptProgress(shopId, jobIds);
  const out = new Map<number, Progress | null>();
  for (const k of kept)
    if (k.fresh) out.set(k.jobId, k.required === null ? null : { required: Number(k.required), done: Number(k.done) });
  const recounted = await countProgress(
    shopId,
    jobIds.filter((id) => !out.has(id)),
  );
  for (const [id, p] of recounted) out.set(id, p);
  return out;
}
