// Writing readings on the tablet. Each write puts the reading and its outbox row in ONE
// transaction (add-together.ts), so a reading is never saved without being queued, nor queued
// without being saved.
import type { EntryMode, Lubricant, MeasureUnit } from "@/lib/domain";
import { skipReasonProblem } from "@/lib/schemas/text-limits";
import { addTogether } from "./add-together";
import type { BenchDb, LocalReading, OutboxRow } from "./db";
import { uuidv4 } from "./ids";

export interface NewReading {
  jobId: number;
  stationId: string;
  value: number | null;
  unit: MeasureUnit;
  entryMode?: EntryMode;
  dialSetting?: number;
  dialDeviation?: number;
  instrumentId?: number;
  lubricant?: Lubricant;
  partTempC?: number;
  skipped?: boolean;
  skipReason?: string;
  supersedes?: string;
  note?: string;
}

export interface WriteContext {
  deviceId: string;
  takenBy: number;
  now?: () => Date;
}

function checkNew(input: NewReading): void {
  if (input.skipped) {
    const problem = skipReasonProblem(input.skipReason ?? "");
    if (problem) throw new Error(problem);
    return;
  }
  if (typeof input.value !== "number" || !Number.isFinite(input.value))
    throw new Error("Enter the value as a number, e.g. 4.0302");
}

// Entries made within one millisecond (a gauge can send two readings that fast) still get
// distinct, increasing times, so the outbox sends them, and the route shows them, in entry order.
let lastInstant = 0;
function nextInstant(now: Date): string {
  lastInstant = Math.max(now.getTime(), lastInstant + 1);
  return new Date(lastInstant).toISOString();
}

/** Saves one reading (pending) and queues it; resolves once both are committed. */
export async function recordReading(db: BenchDb, input: NewReading, ctx: WriteContext): Promise<LocalReading> {
  checkNew(input);
  const at = nextInstant(ctx.now?.() ?? new Date());
  const row: LocalReading = {
    ...input,
    id: uuidv4(),
    value: input.skipped ? null : input.value,
    entryMode: input.entryMode ?? "direct",
    skipped: input.skipped ?? false,
    skipReason: input.skipReason?.trim() || undefined,
    takenAt: at,
    deviceId: ctx.deviceId,
    takenBy: ctx.takenBy,
    state: "pending",
    updatedAt: at,
  };
  await addTogether(db, [
    { table: "readings", row, key: row.id, indexed: { jobId: row.jobId, state: row.state } },
    {
      table: "outbox",
      row: { readingId: row.id, jobId: row.jobId, takenBy: row.takenBy, queuedAt: at, attempts: 0 } satisfies OutboxRow,
      key: row.id,
      indexed: { takenBy: row.takenBy },
    },
  ]);
  return row;
}

/** What the machinist may change on a refused reading before it is sent again. */
export type ReadingFix = Partial<Omit<NewReading, "jobId" | "stationId" | "unit">>;

/**
 * A rejected reading, fixed by the machinist and queued again. It keeps its id: the server
 * wrote nothing for it (a refused batch is rolled back), so the same id is still free there.
 */
export async function resendReading(db: BenchDb, id: string, fix: ReadingFix, now = new Date()): Promise<void> {
  await db.transaction("rw", db.readings, db.outbox, async () => {
    const r = await db.readings.get(id);
    if (!r) throw new Error("That reading is not on this tablet");
    if (r.state !== "rejected") throw new Error("Only a reading the server refused can be sent again");
    const { jobId: _j, stationId: _s, unit: _u, ...changes } = fix as NewReading;
    const next: LocalReading = {
      ...r,
      ...changes,
      state: "pending",
      rejection: undefined,
      updatedAt: now.toISOString(),
    };
    if (!next.skipped && (typeof next.value !== "number" || !Number.isFinite(next.value)))
      throw new Error("Enter the value as a number");
    await db.readings.put(next);
    await db.outbox.put({
      readingId: id,
      jobId: r.jobId,
      takenBy: r.takenBy,
      queuedAt: now.toISOString(),
      attempts: 0,
    });
  });
}

export function readingsOfJob(db: BenchDb, jobId: number): Promise<LocalReading[]> {
  return db.readings.where("jobId").equals(jobId).sortBy("takenAt");
}
