import { z } from "zod";
import { JOB_STATUSES } from "@/lib/domain";
import type { BoardJob } from "./job-views";

// GET /api/jobs: the jobs board, a page at a time, filtered and sorted by the server. The desk keeps
// the same parameters in its address (?status=all&sort=due&page=2), so a reload or a shared link
// shows the same page; an empty parameter means its default.

/** "active": not yet released (intake, measuring, review); "all"; or one status. */
export const BOARD_STATUS_FILTERS = ["active", "all", ...JOB_STATUSES] as const;
export type BoardStatusFilter = (typeof BOARD_STATUS_FILTERS)[number];
export const BOARD_SORTS = ["due", "code", "customer", "status", "progress", "flags"] as const;
export type BoardSort = (typeof BOARD_SORTS)[number];
export const BOARD_PAGE_SIZES = [10, 25, 50, 100] as const;
export const BOARD_SEARCH_MAX = 100;

const blank = (v: unknown) => (v === "" || v === null ? undefined : v);
const wholeFrom1 = "page must be a whole number from 1";
const sizeWords = "pageSize must be 1 to 100";

export const boardQuerySchema = z.object({
  page: z.preprocess(blank, z.coerce.number({ error: wholeFrom1 }).int(wholeFrom1).min(1, wholeFrom1).default(1)),
  pageSize: z.preprocess(
    blank,
    z.coerce.number({ error: sizeWords }).int(sizeWords).min(1, sizeWords).max(100, sizeWords).default(25),
  ),
  status: z.preprocess(
    blank,
    z
      .enum(BOARD_STATUS_FILTERS, { error: `status must be one of ${BOARD_STATUS_FILTERS.join(", ")}` })
      .default("active"),
  ),
  sort: z.preprocess(
    blank,
    z.enum(BOARD_SORTS, { error: `sort must be one of ${BOARD_SORTS.join(", ")}` }).default("due"),
  ),
  dir: z.preprocess(blank, z.enum(["asc", "desc"], { error: "dir must be asc or desc" }).default("asc")),
  /** Part of the job's code or title, the customer's name or the engine's description. */
  q: z.preprocess(
    blank,
    z.string().trim().max(BOARD_SEARCH_MAX, `q (the search) must be at most ${BOARD_SEARCH_MAX} characters`).optional(),
  ),
  /** "1": only jobs with an open flag. */
  flagged: z.preprocess(blank, z.enum(["1", "0"], { error: "flagged must be 1 or 0" }).default("0")),
});
export type BoardQuery = z.output<typeof boardQuerySchema>;

export type BoardPage = {
  jobs: BoardJob[];
  /** Jobs matching the filters, on every page. */
  total: number;
  page: number;
  pageSize: number;
  pageCount: number;
  /** Every job of the shop, whatever the filters (none: the board offers the first job). */
  shopJobs: number;
};
