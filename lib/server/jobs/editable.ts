import "server-only";
import { jobLock, type JobStatus } from "@/lib/domain";
import { AppError } from "@/lib/server/core/errors";

/** Locked jobs (jobLock, the rule readings follow too) are not edited from the desk: job, limits, build plan. */
export function assertJobEditable(job: { status: JobStatus; lockedAt: Date | null }): void {
  const lock = jobLock(job);
  if (!lock.locked) return;
  const state = lock.reason === "closed" ? "closed" : lock.reason === "status" ? `"${job.status}"` : "released";
  throw new AppError(
    "job_locked",
    `This job is ${state} and locked; a lead must reopen it (with a reason) before it can change`,
  );
}
