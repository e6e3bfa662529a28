import "server-only";
import type { BoardJob } from "@/lib/schemas/job";
import { progressOfJobs } from "@/lib/server/jobs/readings";
import { flagCountsByJob, listJobsWithParties, summaryOf } from "@/lib/server/jobs/repo";

// The jobs board: every job of the shop with what the lead scans for at a glance. Progress is
// required-station progress as lib/domain/progress.ts defines it (the bench, the job page and the
// release checklist count the same way).
// Closed jobs show no progress: their record is final and reading them all would slow the board.

export async function listJobBoard(shopId: number): Promise<BoardJob[]> {
  const jobs = await listJobsWithParties(shopId);
  const ids = jobs.map((j) => j.id);
  const [progress, flags] = await Promise.all([
    progressOfJobs(
      shopId,
      jobs.filter((j) => j.status !== "closed"),
    ),
    flagCountsByJob(shopId, ids, ["open", "disposed"]),
  ]);
  return jobs.map((j) => ({
    ...summaryOf(j),
    progress: progress.get(j.id) ?? null,
    flags: { open: flags.get(j.id)!.open, disposed: flags.get(j.id)!.disposed },
    updatedAt: j.updatedAt.toISOString(),
  }));
}
