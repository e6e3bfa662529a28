"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import { JobsFlagCount, JobsProgress } from "@/components/desk/jobs-progress";
import { JobStatusTag, STATUS_WORDS } from "@/components/job-status";
import { JOB_STATUSES } from "@/lib/domain";
import { Loading, LoadFailed } from "./fields";
import { useJobBoard, type BoardJob } from "./queries";

// The lead's board: every job of the shop, filtered, searched and sorted in the browser (a
// shop's jobs fit in one answer; the route returns them all with progress and flag counts).
type SortKey = "due" | "code" | "customer" | "status" | "progress" | "flags";
const FILTERS = [["active", "Open jobs"], ["all", "All"], ...JOB_STATUSES.map((s) => [s, STATUS_WORDS[s]])] as const;
type Filter = (typeof FILTERS)[number][0];

const ratio = (j: BoardJob) => (!j.progress ? -2 : j.progress.required ? j.progress.done / j.progress.required : -1);
const COMPARE: Record<SortKey, (a: BoardJob, b: BoardJob) => number> = {
  due: (a, b) => (a.dueDate ?? "9999").localeCompare(b.dueDate ?? "9999"),
  code: (a, b) => a.code.localeCompare(b.code, undefined, { numeric: true }),
  customer: (a, b) => a.customer.localeCompare(b.customer),
  status: (a, b) => JOB_STATUSES.indexOf(a.status) - JOB_STATUSES.indexOf(b.status),
  progress: (a, b) => ratio(a) - ratio(b),
  flags: (a, b) => a.flags.open - b.flags.open || a.flags.disposed - b.flags.disposed,
};

function visible(
  jobs: BoardJob[],
  filter: Filter,
  query: string,
  flagged: boolean,
  sort: { key: SortKey; asc: boolean },
) {
  const q = query.trim().toLowerCase();
  return jobs
    .filter(
      (j) =>
        filter === "all" ||
        (filter === "active" ? j.status !== "released" && j.status !== "closed" : j.status === filter),
    )
    .filter((j) => !flagged || j.flags.open > 0)
    .filter((j) => !q || [j.code, j.title, j.customer, j.engine].some((s) => s.toLowerCase().includes(q)))
    .sort((a, b) => (sort.asc ? 1 : -1) * (COMPARE[sort.key](a, b) || a.id - b.id));
}

function SortHeader({
  k,
  label,
  sort,
  setSort,
}: {
  k: SortKey;
  label: string;
  sort: { key: SortKey; asc: boolean };
  setSort: (s: { key: SortKey; asc: boolean }) => void;
}) {
  const active = sort.key === k;
  return (
    <th
      scope="col"
      aria-sort={active ? (sort.asc ? "ascending" : "descending") : "none"}
      className="px-3 py-2 text-left"
    >
      <button
        type="button"
        onClick={() => setSort({ key: k, asc: active ? !sort.asc : true })}
        className="inline-flex min-h-11 min-w-11 items-center gap-1 font-semibold hover:text-steel"
      >
        {label}
        <span aria-hidden="true" className="text-xs text-muted">
          {active ? (sort.asc ? "▲" : "▼") : "↕"}
        </span>
      </button>
    </th>
  );
}

function DueCell({ job, today }: { job: BoardJob; today: string }) {
  if (!job.dueDate) return <span className="text-muted">No date</span>;
  const late = job.dueDate < today && job.status !== "released" && job.status !== "closed";
  return (
    <span className="whitespace-nowrap tabular">
      {job.dueDate}
      {late && (
        <span className="ml-2 rounded-tool border border-fail px-1 text-xs font-semibold text-fail">overdue</span>
      )}
    </span>
  );
}

function Row({ j, today }: { j: BoardJob; today: string }) {
  return (
    <tr className="border-t border-rule align-top hover:bg-paper">
      <td className="px-3 py-3">
        <Link href={`/desk/jobs/${j.id}`} className="flex flex-col hover:text-steel">
          <span className="font-mono text-sm text-muted">{j.code}</span>
          <span className="font-semibold underline-offset-2 hover:underline">{j.title}</span>
        </Link>
      </td>
      <td className="px-3 py-3">{j.customer}</td>
      <td className="px-3 py-3">
        <span className="block max-w-64">{j.engine}</span>
        <span className="text-sm text-muted">{j.unitSystem === "in" ? "inch" : "metric"}</span>
      </td>
      <td className="px-3 py-3">
        <JobStatusTag status={j.status} />
      </td>
      <td className="px-3 py-3">
        {j.progress ? (
          <JobsProgress {...j.progress} />
        ) : (
          <span className="text-sm text-muted">Closed: record final</span>
        )}
      </td>
      <td className="px-3 py-3">
        <JobsFlagCount {...j.flags} />
      </td>
      <td className="px-3 py-3">
        <DueCell job={j} today={today} />
      </td>
    </tr>
  );
}

export function JobsBoard({ canCreate }: { canCreate: boolean }) {
  const board = useJobBoard();
  const [filter, setFilter] = useState<Filter>("active");
  const [query, setQuery] = useState("");
  const [flagged, setFlagged] = useState(false);
  const [sort, setSort] = useState<{ key: SortKey; asc: boolean }>({ key: "due", asc: true });
  const rows = useMemo(
    () => visible(board.data ?? [], filter, query, flagged, sort),
    [board.data, filter, query, flagged, sort],
  );
  const today = new Date().toLocaleDateString("en-CA"); // YYYY-MM-DD in the shop's own time zone

  if (board.isPending) return <Loading what="the jobs" />;
  if (board.isError) return <LoadFailed what="the jobs" error={board.error} retry={() => board.refetch()} />;
  if (board.data.length === 0) {
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
  return (
    <section className="flex flex-col gap-4" aria-label="Jobs board">
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex flex-col gap-1 text-sm font-medium">
          Search
          <input
            type="search"
            value={query}
            onChange={(e) => setQuery(e.target.value)}
            placeholder="Code, title, customer or engine"
            className="min-h-11 w-72 rounded-tool border-2 border-rule bg-paper px-3 text-base"
          />
        </label>
        <div role="group" aria-label="Status" className="flex flex-wrap gap-1">
          {FILTERS.map(([value, label]) => (
            <button
              key={value}
              type="button"
              aria-pressed={filter === value}
              onClick={() => setFilter(value)}
              className="min-h-11 rounded-tool border-2 border-rule px-3 text-sm font-medium aria-pressed:border-steel aria-pressed:bg-steel aria-pressed:text-steel-ink"
            >
              {label}
            </button>
          ))}
        </div>
        <label className="flex min-h-11 items-center gap-2 text-sm font-medium">
          <input
            type="checkbox"
            checked={flagged}
            onChange={(e) => setFlagged(e.target.checked)}
            className="h-5 w-5 accent-steel"
          />
          Only jobs with open flags
        </label>
        <span className="ml-auto text-sm text-muted" role="status">
          {rows.length} of {board.data.length} jobs
        </span>
      </div>
      {rows.length === 0 ? (
        <p className="rounded-tool border-2 border-dashed border-rule p-6 text-muted">
          No job matches these filters.{" "}
          <button
            type="button"
            className="font-semibold text-steel underline"
            onClick={() => {
              setFilter("all");
              setQuery("");
              setFlagged(false);
            }}
          >
            Show all jobs
          </button>
        </p>
      ) : (
        <div className="overflow-x-auto rounded-tool border-2 border-rule bg-panel">
          <table className="w-full border-collapse text-left">
            <thead className="bg-paper text-sm">
              <tr>
                <SortHeader k="code" label="Job" sort={sort} setSort={setSort} />
                <SortHeader k="customer" label="Customer" sort={sort} setSort={setSort} />
                <th scope="col" className="px-3 py-2 font-semibold">
                  Engine
                </th>
                <SortHeader k="status" label="Status" sort={sort} setSort={setSort} />
                <SortHeader k="progress" label="Required stations" sort={sort} setSort={setSort} />
                <SortHeader k="flags" label="Flags" sort={sort} setSort={setSort} />
                <SortHeader k="due" label="Due" sort={sort} setSort={setSort} />
              </tr>
            </thead>
            <tbody>
              {rows.map((j) => (
                <Row key={j.id} j={j} today={today} />
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
