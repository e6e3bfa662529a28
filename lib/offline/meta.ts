// Small facts kept beside the data, each under one key of the meta table.
import type { Role } from "@/lib/schemas/enums";
import type { BenchDb } from "./db";
import { uuidv4 } from "./ids";

/** Who is signed in on this tablet, remembered so the bench opens offline (see bench-shell). */
export interface DeviceActor {
  userId: number;
  shopId: number;
  name: string;
  email: string;
  role: Role;
  /** The server's session this tablet holds for them (ended on the server after a sign-out here). */
  sessionId?: string;
}

/**
 * How the last run ended: everything sent, the server not reached (no connection, a timeout), the
 * server answering with an error (5xx), a refusal that needs a person, or a fault on the tablet.
 */
export const SYNC_OUTCOMES = ["sent", "unreachable", "server_error", "refused", "failed"] as const;
export type SyncOutcome = (typeof SYNC_OUTCOMES)[number];

/** What the sync badge shows; written by the sync engine after every run. */
export interface SyncStatus {
  running: boolean;
  lastOutcome?: SyncOutcome;
  lastAttemptAt?: string;
  lastSuccessAt?: string;
  /** In words, for the machinist; absent after a clean run. */
  lastError?: string;
  /** The error needs a person (sign in again, wrong role), not a retry. */
  needsAction?: boolean;
  failures: number;
  nextAttemptAt?: string;
}

/** Per job: the gauge chosen per kind, dial setting sizes per group, and the lubricant last used. */
export interface JobPrefs {
  gauges: Record<string, number>;
  dialMode: boolean;
  dialSettings: Record<string, number>;
  lubricant?: string;
}

export const EMPTY_PREFS: JobPrefs = { gauges: {}, dialMode: false, dialSettings: {} };
export const IDLE_STATUS: SyncStatus = { running: false, failures: 0 };

export async function getMeta<T>(db: BenchDb, key: string): Promise<T | undefined> {
  return (await db.meta.get(key))?.value as T | undefined;
}

export async function setMeta<T>(db: BenchDb, key: string, value: T): Promise<void> {
  await db.meta.put({ key, value });
}

/** The tablet's id, made once and kept (every reading carries it). */
export async function ensureDeviceId(db: BenchDb): Promise<string> {
  return db.transaction("rw", db.meta, async () => {
    const have = await getMeta<string>(db, "deviceId");
    if (have) return have;
    const id = `tab-${uuidv4()}`;
    await setMeta(db, "deviceId", id);
    return id;
  });
}

export async function getSyncStatus(db: BenchDb): Promise<SyncStatus> {
  return (await getMeta<SyncStatus>(db, "syncStatus")) ?? IDLE_STATUS;
}

export async function patchSyncStatus(db: BenchDb, patch: Partial<SyncStatus>): Promise<void> {
  await db.transaction("rw", db.meta, async () => {
    await setMeta(db, "syncStatus", { ...(await getSyncStatus(db)), ...patch });
  });
}

export const prefsKey = (jobId: number) => `prefs:${jobId}`;

export async function getJobPrefs(db: BenchDb, jobId: number): Promise<JobPrefs> {
  return { ...EMPTY_PREFS, ...(await getMeta<JobPrefs>(db, prefsKey(jobId))) };
}

export async function patchJobPrefs(db: BenchDb, jobId: number, patch: Partial<JobPrefs>): Promise<void> {
  await db.transaction("rw", db.meta, async () => {
    await setMeta(db, prefsKey(jobId), { ...(await getJobPrefs(db, jobId)), ...patch });
  });
}
