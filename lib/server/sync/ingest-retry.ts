import "server-only";

// Deadlocks and lock-wait timeouts are normal under load in InnoDB: the answer is to run the
// whole transaction again. A duplicate key on a reading id means another batch stored that id
// between our check and our insert; running again turns it into a replay or a conflict.
const RETRYABLE = new Set([1213 /* ER_LOCK_DEADLOCK */, 1205 /* ER_LOCK_WAIT_TIMEOUT */, 1062 /* ER_DUP_ENTRY */]);
const ATTEMPTS = 6;

function errnoOf(err: unknown): number | undefined {
  const e = err as { parent?: { errno?: number }; original?: { errno?: number }; errno?: number } | null;
  return e?.parent?.errno ?? e?.original?.errno ?? e?.errno;
}

export const isRetryable = (err: unknown) => RETRYABLE.has(errnoOf(err) ?? -1);

export async function withDeadlockRetry<T>(fn: () => Promise<T>): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await fn();
    } catch (err) {
      if (!isRetryable(err) || attempt >= ATTEMPTS) throw err;
      // Jittered backoff, so the transactions that collided do not collide again.
      await new Promise((r) => setTimeout(r, Math.random() * 20 * attempt));
    }
  }
}
