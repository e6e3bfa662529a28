// Job packs on the tablet, and the server's changes folded into them. Every server copy is the
// entity's current state, so applying one twice is harmless; a local reading the server turns
// out to hold already counts as acknowledged (its outbox row goes, in the same transaction).
import type { BenchFlag, JobPack, ServerReading, SyncFeed } from "@/lib/schemas/sync";
import type { BenchDb } from "./db";
import { getMeta, setMeta } from "./meta";
import { fromServerReading } from "./wire";

const older = (a: string, b: string) => (BigInt(a) < BigInt(b) ? a : b);

async function mergeReadings(db: BenchDb, readings: ServerReading[]): Promise<void> {
  for (const s of readings) {
    const local = await db.readings.get(s.id);
    await db.readings.put(fromServerReading(s, local));
    if (local && local.state !== "synced") await db.outbox.delete(s.id);
  }
}

function mergeFlags(current: BenchFlag[], incoming: BenchFlag[], jobId: number): BenchFlag[] {
  const byId = new Map(current.map((f) => [f.id, f]));
  for (const f of incoming) if (f.jobId === jobId) byId.set(f.id, f);
  return [...byId.values()].filter((f) => f.state !== "closed");
}

/** Stores a freshly fetched pack. The device cursor never moves past what the pack includes. */
export async function savePack(db: BenchDb, pack: JobPack, now = new Date()): Promise<void> {
  await db.transaction("rw", db.jobs, db.readings, db.outbox, db.meta, async () => {
    const have = await db.jobs.get(pack.job.id);
    const at = now.toISOString();
    await db.jobs.put({ jobId: pack.job.id, pack, openedAt: have?.openedAt ?? at, refreshedAt: at });
    await mergeReadings(db, pack.readings);
    const cursor = await getMeta<string>(db, "cursor");
    await setMeta(db, "cursor", cursor ? older(cursor, pack.cursor) : pack.cursor);
  });
}

/** Folds one page of GET /api/sync into the packs and readings, and moves the cursor. */
export async function applyFeed(db: BenchDb, feed: SyncFeed, now = new Date()): Promise<void> {
  await db.transaction("rw", db.jobs, db.readings, db.outbox, db.meta, async () => {
    await mergeReadings(db, feed.readings);
    const ids = new Set([
      ...feed.jobs.map((j) => j.id),
      ...feed.limits.map((l) => l.jobId),
      ...feed.flags.map((f) => f.jobId),
      ...feed.missing,
    ]);
    for (const jobId of ids) {
      const row = await db.jobs.get(jobId);
      if (!row) continue;
      const header = feed.jobs.find((j) => j.id === jobId);
      const limits = feed.limits.find((l) => l.jobId === jobId);
      const pack: JobPack = {
        ...row.pack,
        job: header ? { ...row.pack.job, ...header } : row.pack.job,
        spec: limits ? limits.spec : row.pack.spec,
        flags: mergeFlags(row.pack.flags, feed.flags, jobId),
      };
      if (limits) pack.job = { ...pack.job, specRevision: limits.specRevision };
      await db.jobs.put({
        ...row,
        pack,
        refreshedAt: now.toISOString(),
        gone: feed.missing.includes(jobId) || undefined,
      });
    }
    await setMeta(db, "cursor", feed.cursor);
  });
}

export function heldJobIds(db: BenchDb): Promise<number[]> {
  return db.jobs.filter((j) => !j.gone).primaryKeys();
}
