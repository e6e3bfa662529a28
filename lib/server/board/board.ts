import "server-only";
import { JOB_STATUSES, OPEN_JOB_STATUSES } from "@/lib/domain";
import type { BoardPage, BoardQuery } from "@/lib/schemas/job-board";
import { countProgress, refreshProgress } from "@/lib/server/board/progress";
import type { Progress } from "@/lib/server/jobs/readings";
import { boardRows } from "@/lib/server/board/repo";

// The jobs board (GET /api/jobs): one page of the shop's jobs, filtered, searched, sorted and paged
// in SQL, with required-station progress as lib/domain/progress.ts counts it (kept per job, see
// progress.ts) and open and awaiting-re-check flags counted for the page's jobs only.
// Closed jobs show no progress: their record is final.

const countedStatuses = (q: BoardQuery) =>
  q.status === "all"
    ? JOB_STATUSES.filter((s) => s !== "closed")
    : q.status === "active"
      ? OPEN_JOB_STATUSES
      : [q.status];

export async function listJobBoard(shopId: number, q: BoardQuery): Promise<BoardPage> {
  // Sorting by progress ranks every matching job, so every count must be fresh first; any other
  // sort needs only the page's own.
  if (q.sort === "progress" && q.status !== "closed") await refreshProgress(shopId, countedStatuses(q));
  const { rows, total, shopJobs } = await boardRows(shopId, q);
  const stale = rows.filter((r) => !r.fresh && r.status !== "closed").map((r) => r.id);
  const recounted = stale.length ? await countProgress(shopId, stale) : new Map<number, Progress | null>();
  const progressOf = (r: (typeof rows)[number]) => {
    if (r.status === "closed") return null;
    if (recounted.has(r.id)) return recounted.get(r.id) ?? null;
    return r.required === null ? null : { done: Number(r.done), required: Number(r.required) };
  };
  return {
    jobs: rows.map((r) => ({
      id: r.id,
      code: r.code,
      title: r.title,
      status: r.status,
      unitSystem: r.unitSystem,
      dueDate: r.dueDate ?? null,
      customer: r.customer,
      engine: r.engine ?? "",
      progress: progressOf(r),
      flags: { open: r.openFlags, disposed: r.disposedFlags },
      updatedAt: new Date(r.updatedAt).toISOString(),
    })),
    total,
    page: q.page,
    pageSize: q.pageSize,
    pageCount: Math.max(1, Math.ceil(total / q.pageSize)),
    shopJobs,
  };
}
