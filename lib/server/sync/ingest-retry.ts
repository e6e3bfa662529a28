import "server-only";
import { isConflict, withConflictRetry } from "@/lib/server/core/cluster";

// A batch is one transaction; when it ends in a conflict it runs again from the start and so ends
// all or nothing, exactly as on one node. Conflicts: InnoDB deadlocks and lock-wait timeouts, and
// on Galera another node's commit to the same rows (the job's readings, flags, the shop's change
// sequence), which fails our COMMIT with 1213 (core/cluster.ts). A duplicate key on a reading id
// means another batch stored that id between our check and our insert; running again turns it into
// a replay or a conflict. Attempts are generous: on a cluster every batch of a shop ends by bumping
// the shop's change sequence (sync/repo.ts), so batches through two nodes at once collide often.
const ER_DUP_ENTRY = 1062;
const ATTEMPTS = 12;

function errnoOf(err: unknown): number | undefined {
  const e = err as { parent?: { errno?: number }; original?: { errno?: number }; errno?: number } | null;
  return e?.parent?.errno ?? e?.original?.errno ?? e?.errno;
}

export const isRetryable = (err: unknown) => isConflict(err) || errnoOf(err) === ER_DUP_ENTRY;

export function withDeadlockRetry<T>(fn: () => Promise<T>): Promise<T> {
  return withConflictRetry(fn, { attempts: ATTEMPTS, retryable: isRetryable });
}
