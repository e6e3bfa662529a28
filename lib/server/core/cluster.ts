import "server-only";
import { QueryTypes, type Transaction } from "sequelize";
import { getSequelize } from "@/lib/server/core/db";
import { sqlRows } from "@/lib/server/core/sql-driver";

// What running on a MariaDB Galera cluster asks of the code, in one place (harmless on one node).
//
// Causal reads: a node applies the other nodes' commits a moment after they happen, so a read on
// one node may not yet see a commit made through another. A read that must see it (a job's limits
// before judging readings, a sign-in lock) runs with wsrep_sync_wait = 1: the node first applies
// everything the cluster had committed when the read arrived. SET STATEMENT scopes it to that one
// statement, so no pooled connection keeps it. Without Galera (wsrep off) the server skips the wait;
// a server built without wsrep does not know the variable (1193), and then the plain read is the same.
//
// Conflicts: SELECT … FOR UPDATE locks only on the local node; two nodes writing the same row both
// go ahead, and the later one fails AT COMMIT with 1213 (deadlock). InnoDB also ends a transaction
// with 1213 or 1205 on one node under load. Either way the answer is to run the whole transaction
// again: it then reads what the other one committed.

const UNKNOWN_VARIABLE = 1193;
let causalSupported = true;

function errnoOf(err: unknown): number | undefined {
  const e = err as { parent?: { errno?: number }; original?: { errno?: number }; errno?: number } | null;
  return e?.parent?.errno ?? e?.original?.errno ?? e?.errno;
}

/** `sql` (one SELECT) run only after this node has applied every commit the cluster had made. */
export const causalSql = (sql: string) => (causalSupported ? `SET STATEMENT wsrep_sync_wait = 1 FOR ${sql}` : sql);

/** Rows of a causal read, in `t` (on its connection) or on its own. */
export async function causalRows<T extends object>(
  t: Transaction | null,
  sql: string,
  values: unknown[] = [],
): Promise<T[]> {
  const run = (text: string): Promise<T[]> =>
    t ? sqlRows<T>(t, text, values) : getSequelize().query<T>(text, { replacements: values, type: QueryTypes.SELECT });
  try {
    return await run(causalSql(sql));
  } catch (err) {
    if (!causalSupported || errnoOf(err) !== UNKNOWN_VARIABLE) throw err;
    causalSupported = false;
    return run(sql);
  }
}

/** 1213 deadlock (or a Galera certification conflict at commit), 1205 lock wait timeout. */
const CONFLICTS = new Set([1213, 1205]);
export const isConflict = (err: unknown) => CONFLICTS.has(errnoOf(err) ?? -1);

export type RetryOptions = { attempts?: number; retryable?: (err: unknown) => boolean };

/**
 * Runs `fn` (one whole transaction) again while it fails with a conflict, with a growing, jittered
 * pause, so the transactions that collided do not collide again; the last failure is thrown.
 */
export async function withConflictRetry<T>(fn: () => Promise<T>, opts: RetryOptions = {}): Promise<T> {
  const attempts = opts.attempts ?? 8;
  const retryable = opts.retryable ?? isConflict;
  for (let attempt = 1; ; attempt++) {
    try {
      return await fn();
    } catch (err) {
      if (!retryable(err) || attempt >= attempts) throw err;
      await new Promise((r) => setTimeout(r, Math.random() * Math.min(200, 10 * 2 ** attempt)));
    }
  }
}

/**
 * A transaction run again from the start while it ends in a conflict. For every transaction that
 * writes the change feed: on a cluster they all number their changes in the shop's sequence, so two
 * of them through different nodes at once conflict at commit (sync/repo.ts).
 */
export function retriedTransaction<T>(fn: (t: Transaction) => Promise<T>): Promise<T> {
  return withConflictRetry(() => getSequelize().transaction(fn));
}
