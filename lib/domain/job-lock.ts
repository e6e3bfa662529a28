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
    return `Job ${job.code} has the status "${job.status}", which takes no readings. Ask the lead to set it to ${OPEN_JOB_STATUSES.join(", ")}.`;
  const when = job.lockedAt ?? job.updatedAt;
  const on = when ? ` on ${DATE.format(new Date(when))}` : "";
  return `Job ${job.code} was ${lock.reason}${on}; readings are locked. Ask the lead to reopen it.`;
}
