// The tablet's one database: a typed Dexie singleton. Everything the bench
// needs to work with no network lives here: the job packs opened on this device, every reading
// with its sync state, the outbox of readings the server has not acknowledged, photos taken
// offline, and small facts (device id, sync cursor, sync status, who is signed in).
// Rule: nothing is deleted before the server acknowledged it; readings are never deleted at all.
import Dexie, { type EntityTable } from "dexie";
import type { EntryMode, Lubricant, MeasureUnit, Verdict } from "@/lib/domain";
import type { AttachmentOwnerType } from "@/lib/schemas/enums";
import type { FieldErrors } from "@/lib/schemas/errors";
import type { JobPack, RejectCode } from "@/lib/schemas/sync";
import type { StudyDraft } from "./study-draft-shape";

export type SyncState = "pending" | "synced" | "rejected";

/** One reading on the tablet. Field names follow the push contract (lib/schemas/sync.ts). */
export interface LocalReading {
  id: string;
  jobId: number;
  stationId: string;
  /** In `unit`, as entered (dial mode: the computed diameter); null when skipped. */
  value: number | null;
  unit: MeasureUnit;
  entryMode: EntryMode;
  dialSetting?: number;
  dialDeviation?: number;
  instrumentId?: number;
  partTempC?: number;
  gaugeTempC?: number;
  lubricant?: Lubricant;
  skipped: boolean;
  skipReason?: string;
  /** The reading this one corrects (measure again, confirm, lead sent it back). */
  supersedes?: string;
  note?: string;
  takenAt: string;
  deviceId: string;
  /** Who was signed in on the tablet; only their session may send it. */
  takenBy: number;
  state: SyncState;
  /** The server's verdict once synced; before that the tablet's preview is computed on screen. */
  verdict?: Verdict | null;
  verdictNote?: string | null;
  deviation?: number | null;
  limitMin?: number | null;
  limitMax?: number | null;
  rejection?: { code: RejectCode | string; reason: string; errors?: FieldErrors };
  /** Set from the server's copy: the reading that corrects this one. */
  supersededBy?: string | null;
  updatedAt: string;
}

/** A reading waiting for the server. Keyed by the reading id, so one reading is queued once. */
export interface OutboxRow {
  readingId: string;
  jobId: number;
  takenBy: number;
  queuedAt: string;
  attempts: number;
}

export interface JobRow {
  jobId: number;
  pack: JobPack;
  openedAt: string;
  refreshedAt: string;
  /** The server no longer offers this job to this user (feed `missing`). */
  gone?: boolean;
}

export type PhotoState = "pending" | "uploaded" | "rejected";

export interface PhotoRow {
  id: string;
  jobId: number;
  /** The tablet photographs jobs and readings; gauge photos come from the admin screen. */
  ownerType: Exclude<AttachmentOwnerType, "instrument">;
  ownerId: string;
  /** Cleared once the server holds the file, to give the tablet its space back. */
  blob: Blob | null;
  contentType: string;
  name: string;
  size: number;
  createdAt: string;
  takenBy: number;
  state: PhotoState;
  error?: string;
}

export interface MetaRow {
  key: string;
  value: unknown;
}

/** A gauge study in progress, one per person and kind (lib/offline/study-drafts.ts). */
export interface StudyDraftRow {
  /** `${userId}:${kind}`. */
  id: string;
  userId: number;
  draft: StudyDraft;
  startedAt: string;
  updatedAt: string;
}

export class BenchDb extends Dexie {
  jobs!: EntityTable<JobRow, "jobId">;
  readings!: EntityTable<LocalReading, "id">;
  outbox!: EntityTable<OutboxRow, "readingId">;
  photos!: EntityTable<PhotoRow, "id">;
  meta!: EntityTable<MetaRow, "key">;
  studyDrafts!: EntityTable<StudyDraftRow, "id">;

  constructor(name = "tenthwise-bench") {
    // No optimistic live-query cache: it re-evaluates every watched query inside each write,
    // which the entry's commit would wait on; live queries simply re-read after the commit.
    super(name, { cache: "disabled" });
    this.version(1).stores({
      jobs: "jobId, openedAt",
      readings: "id, jobId, [jobId+stationId], state, takenAt",
      outbox: "readingId, jobId, takenBy, queuedAt",
      photos: "id, jobId, ownerId, state",
      meta: "key",
    });
    // Only the indexes a query uses: every index is one more write inside each entry's
    // transaction, and the entry's commit time is what the machinist waits on.
    this.version(2).stores({
      jobs: "jobId",
      readings: "id, jobId, state",
      outbox: "readingId, takenBy",
      photos: "id, jobId, state",
    });
    // Gauge studies in progress, kept per person so a shared tablet's sign-out keeps each one's run.
    this.version(3).stores({ studyDrafts: "id, userId" });
  }
}

let instance: BenchDb | undefined;

/** The browser's one database. Tests make their own `new BenchDb(name)`. */
export function getBenchDb(): BenchDb {
  instance ??= new BenchDb();
  return instance;
}
