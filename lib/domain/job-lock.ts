// Whether a job accepts readings and edits (rule of this product). The sync ingest, the tablet's
// read-only state, the desk's edit pages, flag decisions, attachments and release signing all ask
// this one function. Each clause stands on its own:
// - closed: the job's record is final;
// - released: an inspector signed it;
// - lockedAt set: a standing release locks the job even if its status was edited afterwards
//   (reopening clears lockedAt and the status together);
// - any status that is not an open one: a status this code does not know takes no readings,
//   so a new status fails safe.
import type { JobStatus } from "./enums";

/** The statuses in which a job takes readings (the bench lists only these). */
export const OPEN_JOB_STATUSES = ["intake", "measuring", "review"] as const satisfies readonly JobStatus[];
export type OpenJobStatus = (typeof OPEN_JOB_STATUSES)[number];

export type JobLockReason = "closed" | "released" | "locked" | "status";
export type JobLock = { locked: false; reason: null } | { locked: true; reason: JobLockReason };

export interface JobLockFacts {
  status: string;
  lockedAt?: Date | string | null;
}

const isOpenStatus = (s: string): s is OpenJobStatus => (OPEN_JOB_STATUSES as readonly string[]).includes(s);

export function jobLock(job: JobLockFacts): JobLock {
  if (job.status === "closed") return { locked: true, reason: "closed" };
  if (job.status === "released") return { locked: true, reason: "released" };
  if (job.lockedAt) return { locked: true, reason: "locked" };
  if (!isOpenStatus(job.status)) return { locked: true, reason: "status" };
  return { locked: false, reason: null };
}

export const isJobLocked = (job: JobLockFacts): boolean => jobLock(job).locked;

const DATE = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });

/**
 * Why a job refuses readings, in words for the machinist, or null when it takes them. The date is
 * when it was locked, else (closed by a status edit) when the job last changed.
 */
export function jobLockReason(job: JobLockFacts & { code: string; updatedAt?: Date | string | null }): string | null {
  const lock = jobLock(job);
  if (!lock.locked) return null;
  if (lock.reason === "status")
    return `Job ${job.code} has the status "${job.status}", which takes no readings. ${lockWayOut(lock.reason)}`;
  const when = job.lockedAt ?? job.updatedAt;
  const on = when ? ` on ${DATE.format(new Date(when))}` : "";
  return `Job ${job.code} was ${lock.reason}${on}; readings are locked. ${lockWayOut(lock.reason)}`;
}

/**
 * What lifts a lock, in the words every screen and refusal uses (rule of this product): only a
 * standing release is undone, by a lead reopening the job with a reason, from the job page or the
 * release page; a closed job is final.
 */
export function lockWayOut(reason: JobLockReason): string {
  if (reason === "closed") return "A closed job is final and is not reopened.";
  if (reason === "status") return `A lead can set it back to ${OPEN_JOB_STATUSES.join(", ")}.`;
  return "Only a lead can reopen it, with a reason, from the job page or the release page; that voids the release.";
}

/**
 * What a desk screen says about a locked job, from a view's status and locked flag (views carry
 * no lock date): "This job is released: its limits cannot change. Only a lead can reopen it…".
 * Null when the job is not locked.
 */
export function lockedJobWords(job: { status: string; locked: boolean; code?: string }, what: string): string | null {
  if (!job.locked) return null;
  const reason = jobLock({ status: job.status, lockedAt: null }).reason ?? "locked";
  const state = reason === "closed" ? "closed" : reason === "status" ? `“${job.status}”` : "released";
  return `${job.code ? `Job ${job.code}` : "This job"} is ${state}: ${what} cannot change. ${lockWayOut(reason)}`;
}
