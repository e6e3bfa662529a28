// The outbox: which readings go in the next push, and what the server's answer does to them.
// An outbox row leaves only when the server answered for its reading (accepted or rejected);
// a reading "held" (refused batch, nothing written) or lost in transit stays queued.
import type { PushReadingInput, PushResult } from "@/lib/schemas/sync";
import type { BenchDb, LocalReading } from "./db";
import { toPushReading } from "./wire";

/** Readings per push; well under the contract's MAX_BATCH (tests/lib/offline check it). */
export const BATCH_SIZE = 100;

export interface Batch {
  readings: LocalReading[];
  payload: PushReadingInput[];
}

/** The oldest queued readings taken by `userId` (another person's wait for their own session). */
export async function nextBatch(
  db: BenchDb,
  userId: number,
  size = BATCH_SIZE,
  exclude: ReadonlySet<string> = new Set(),
): Promise<Batch> {
  return db.transaction("r", db.outbox, db.readings, async () => {
    const rows = await db.outbox.where("takenBy").equals(userId).sortBy("queuedAt");
    const ids = rows
      .map((r) => r.readingId)
      .filter((id) => !exclude.has(id))
      .slice(0, size);
    const readings = (await db.readings.bulkGet(ids)).filter((r): r is LocalReading => r !== undefined);
    return { readings, payload: readings.map(toPushReading) };
  });
}

export interface PushOutcome {
  accepted: number;
  rejected: number;
  held: number;
}

/** Applies the server's per-item answer to the batch that was sent, in one transaction. */
export async function applyPushResults(
  db: BenchDb,
  sent: LocalReading[],
  results: PushResult[],
  now = new Date(),
): Promise<PushOutcome> {
  const outcome: PushOutcome = { accepted: 0, rejected: 0, held: 0 };
  const at = now.toISOString();
  await db.transaction("rw", db.readings, db.outbox, async () => {
    for (const res of results) {
      const id = res.id ?? sent[res.index]?.id;
      const local = id ? await db.readings.get(id) : undefined;
      if (!id || !local) continue;
      if (res.status === "accepted") {
        const e = res.evaluation;
        await db.readings.put({
          ...local,
          state: "synced",
          rejection: undefined,
          updatedAt: at,
          verdict: e.verdict,
          verdictNote: e.verdictNote,
          deviation: e.deviation,
          limitMin: e.limitMin,
          limitMax: e.limitMax,
        });
        await db.outbox.delete(id);
        outcome.accepted++;
      } else if (res.status === "rejected") {
        await db.readings.put({
          ...local,
          state: "rejected",
          rejection: { code: res.code, reason: res.reason, ...(res.errors ? { errors: res.errors } : {}) },
          updatedAt: at,
        });
        await db.outbox.delete(id);
        outcome.rejected++;
      } else {
        await db.outbox.update(id, (row) => void (row.attempts += 1));
        outcome.held++;
      }
    }
  });
  return outcome;
}

/** Queued readings taken by others than `userId` (they wait for their own sign-in). */
export async function waitingForOthers(db: BenchDb, userId: number): Promise<number> {
  return db.outbox.filter((r) => r.takenBy !== userId).count();
}

/**
 * Readings the server will never take as sent: kept on the tablet, marked refused with the server's
 * words (the bench shows them and offers the fix), and out of the outbox until fixed and resent.
 */
export async function markRefused(
  db: BenchDb,
  refused: { id: string; rejection: NonNullable<LocalReading["rejection"]> }[],
  now = new Date(),
): Promise<void> {
  const at = now.toISOString();
  await db.transaction("rw", db.readings, db.outbox, async () => {
    for (const { id, rejection } of refused) {
      const local = await db.readings.get(id);
      if (!local) continue;
      await db.readings.put({ ...local, state: "rejected", rejection, updatedAt: at });
      await db.outbox.delete(id);
    }
  });
}
