"use client";

import Link from "next/link";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useEffect, useMemo, useState } from "react";
import { Pager } from "@/components/flags/pager";
import { STATUS_WORDS } from "@/components/job-status";
import { JOB_STATUSES } from "@/lib/domain";
import { BOARD_SEARCH_MAX, boardQuerySchema, type BoardQuery, type BoardStatusFilter } from "@/lib/schemas/job-board";
import { Loading, LoadFailed } from "./fields";
import { JobsTable } from "./jobs-board-table";
import { useJobBoard } from "./queries";

// The lead's board: a page of the shop's jobs, filtered, searched and sorted by the server
// (GET /api/jobs). The view lives in the address (?status=all&sort=flags&dir=desc&page=3), so a
// reload, the back button or a shared link shows the same page; the shown page stays on screen
// while the next one loads.
const FILTERS: [BoardStatusFilter, string][] = [
  ["active", "Open jobs"],
  ["all", "All"],
  ...JOB_STATUSES.map((s): [BoardStatusFilter, string] => [s, STATUS_WORDS[s]]),
];
const FILTER_BUTTON = [
  "min-h-11 rounded-tool border-2 border-rule px-3 text-sm font-medium",
  "aria-pressed:border-steel aria-pressed:bg-steel aria-pressed:text-steel-ink",
].join(" ");
const DEFAULTS = boardQuerySchema.parse({});
const SEARCH_PAUSE_MS = 300;

function readQuery(params: URLSearchParams): BoardQuery {
  const parsed = boardQuerySchema.safeParse(Object.fromEntries(params));
  return parsed.success ? parsed.data : DEFAULTS;
}

/** The query as address parameters, defaults left out so the plain board has a plain address. */
function toParams(q: BoardQuery): string {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(q))
    if (v !== undefined && v !== DEFAULTS[k as keyof BoardQuery]) p.set(k, String(v));
  return p.toString();
}

function SearchField({ value, onSearch }: { value: string; onSearch: (q: string) => void }) {
  const [text, setText] = useState(value);
  useEffect(() => setText(value), [value]);
  useEffect(() => {
    if (text.trim() === value) return;
    const wait = setTimeout(() => onSearch(text.trim()), SEARCH_PAUSE_MS);
    return () => clearTimeout(wait);
  }, [text, value, onSearch]);
  return (
    <label className="flex flex-col gap-1 text-sm font-medium">
      Search
      <input
        type="search"
        value={text}
        maxLength={BOARD_SEARCH_MAX}
        onChange={(e) => setText(e.target.value)}
        placeholder="Code, title, customer or engine"
        className="min-h-11 w-72 rounded-tool border-2 border-rule bg-paper px-3 text-base"
      />
    </label>
  );
}

function NoJobsYet({ canCreate }: { canCreate: boolean }) {
  return (
    <p className="rounded-tool border-2 border-dashed border-rule p-6 text-muted">
      No jobs yet.{" "}
      {canCreate ? (
        <Link className="font-semibold text-steel underline" href="/desk/jobs/new">
          Create the first job
        </Link>
      ) : (
        "The lead builder creates them."
      )}
    </p>
  );
}

export function JobsBoard({ canCreate }: { canCreate: boolean }) {
  const router = useRouter();
  const pathname = usePathname();
  const search = useSearchParams();
  const q = useMemo(() => readQuery(new URLSearchParams(search.toString())), [search]);
  const set = (patch: Partial<BoardQuery>) =>
    router.replace(`${pathname}?${toParams({ ...q, page: 1, ...patch })}`, { scroll: false });
  const board = useJobBoard(toParams(q));

  if (board.isPending) return <Loading what="the jobs" />;
  if (board.isError && !board.data)
    return <LoadFailed what="the jobs" error={board.error} retry={() => board.refetch()} />;
  const data = board.data!;
  if (data.shopJobs === 0) return <NoJobsYet canCreate={canCreate} />;
  return (
    <section className="flex flex-col gap-4" aria-label="Jobs board">
      <div className="flex flex-wrap items-end gap-3">
        <SearchField value={q.q ?? ""} onSearch={(text) => set({ q: text || undefined })} />
        <div role="group" aria-label="Status" className="flex flex-wrap gap-1">
          {FILTERS.map(([value, label]) => (
            <button
              key={value}
              type="button"
              aria-pressed={q.status === value}
              onClick={() => set({ status: value })}
              className={FILTER_BUTTON}
            >
              {label}
            </button>
          ))}
        </div>
        <label className="flex min-h-11 items-center gap-2 text-sm font-medium">
          <input
            type="checkbox"
            checked={q.flagged === "1"}
            onChange={(e) => set({ flagged: e.target.checked ? "1" : "0" })}
            className="h-5 w-5 accent-steel"
          />
          Only jobs with open flags
        </label>
        <span className="ml-auto text-sm text-muted" role="status" data-testid="board-count">
          {data.total} of {data.shopJobs} jobs
        </span>
      </div>
      {board.isError && <LoadFailed what="the next page" error={board.error} retry={() => board.refetch()} />}
      {data.total === 0 ? (
        <p className="rounded-tool border-2 border-dashed border-rule p-6 text-muted">
          No job matches these filters.{" "}
          <button
            type="button"
            className="min-h-11 font-semibold text-steel underline"
            onClick={() => set({ status: "all", q: undefined, flagged: "0" })}
          >
            Show all jobs
          </button>
        </p>
      ) : (
        <>
          <div
            className="overflow-x-auto rounded-tool border-2 border-rule bg-panel"
            aria-busy={board.isFetching}
            data-testid="jobs-table"
          >
            <JobsTable
              rows={data.jobs}
              sort={{ key: q.sort, asc: q.dir === "asc" }}
              onSort={(s) => set({ sort: s.key, dir: s.asc ? "asc" : "desc" })}
            />
            {data.jobs.length === 0 && (
              <p className="p-4 text-muted">
                Page {data.page} is past the last page.{" "}
                <button
                  type="button"
                  className="min-h-11 font-semibold text-steel underline"
                  onClick={() => set({ page: data.pageCount })}
                >
                  Go to page {data.pageCount}
                </button>
              </p>
            )}
          </div>
          {/* The figures of the page on screen (the last one, while the next loads). */}
          <Pager
            page={data.page}
            pageCount={data.pageCount}
            pageSize={data.pageSize}
            total={data.total}
            what="jobs"
            onPage={(p) => set({ page: p })}
            onPageSize={(n) => set({ pageSize: n })}
          />
        </>
      )}
    </section>
  );
}
