// Who may reopen a job, and when (rule of this product). Reopening voids the standing release, so
// it is the lead's call (the person who answers for the work), never the inspector's who signed
// it, and only while a release stands; a closed job is final. The release page, the job page and
// the server all ask this one function; lockWayOut (job-lock.ts) says the same in words.
import { jobLock, lockWayOut, type JobLockFacts } from "./job-lock";

/** The roles that may reopen a released job. */
export const REOPEN_ROLES = ["lead"] as const;

export interface ReopenFacts extends JobLockFacts {
  code: string;
  /** Whether the job has a release that is not void. */
  hasStandingRelease: boolean;
}

export type ReopenRefusal = { code: "forbidden" | "conflict"; message: string };

const mayReopen = (role: string) => (REOPEN_ROLES as readonly string[]).includes(role);

/** Why this person may not reopen this job now, or null when they may. */
export function reopenRefusal(role: string, job: ReopenFacts): ReopenRefusal | null {
  if (!mayReopen(role)) return { code: "forbidden", message: "Only a lead can reopen a released job." };
  const lock = jobLock(job);
  if (lock.reason === "closed")
    return { code: "conflict", message: `Job ${job.code} is closed. ${lockWayOut("closed")}` };
  if (!job.hasStandingRelease || (lock.reason !== "released" && lock.reason !== "locked")) {
    return {
      code: "conflict",
      message: `Job ${job.code} is not released (it is ${job.status}), so there is nothing to reopen.`,
    };
  }
  return null;
}

export const canReopen = (role: string, job: ReopenFacts): boolean => reopenRefusal(role, job) === null;
