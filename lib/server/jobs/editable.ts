import "server-only";
import { jobLock, lockedJobWords, type JobStatus } from "@/lib/domain";
import { AppError } from "@/lib/server/core/errors";

/** Locked jobs (jobLock, the rule readings follow too) are not edited from the desk: job, limits, build plan. */
export function assertJobEditable(job: { status: JobStatus; lockedAt: Date | null }): void {
  const lock = jobLock(job);
  if (!lock.locked) return;
  throw new AppError("job_locked", lockedJobWords({ status: job.status, locked: true }, "it")!);
}
