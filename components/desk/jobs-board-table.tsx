"use client";

import Link from "next/link";
import { JobsFlagCount, JobsProgress } from "@/components/desk/jobs-progress";
import { JobStatusTag } from "@/components/job-status";
import type { BoardSort } from "@/lib/schemas/job-board";
import type { BoardJob } from "./queries";

// The board's table: one page of jobs as the server sorted them; a column header asks for that
// sort (again: the other way).
export type SortState = { key: BoardSort; asc: boolean };

function SortHeader({
  k,
  label,
  sort,
  onSort,
}: {
  k: BoardSort;
  label: string;
  sort: SortState;
  onSort: (s: SortState) => void;
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
        onClick={() => onSort({ key: k, asc: active ? !sort.asc : true })}
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
        <Link href={`/desk/jobs/${j.id}`} className="flex min-h-11 flex-col hover:text-steel">
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
          <span className="text-sm text-muted">
            {j.status === "closed" ? "Closed: record final" : "No engine route yet"}
          </span>
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

export function JobsTable({
  rows,
  sort,
  onSort,
}: {
  rows: BoardJob[];
  sort: SortState;
  onSort: (s: SortState) => void;
}) {
  const today = new Date().toLocaleDateString("en-CA"); // YYYY-MM-DD in the shop's own time zone
  const header = (k: BoardSort, label: string) => <SortHeader k={k} label={label} sort={sort} onSort={onSort} />;
  return (
    <table className="w-full border-collapse text-left">
      <thead className="bg-paper text-sm">
        <tr>
          {header("code", "Job")}
          {header("customer", "Customer")}
          <th scope="col" className="px-3 py-2 font-semibold">
            Engine
          </th>
          {header("status", "Status")}
          {header("progress", "Required stations")}
          {header("flags", "Flags")}
          {header("due", "Due")}
        </tr>
      </thead>
      <tbody>
        {rows.map((j) => (
          <Row key={j.id} j={j} today={today} />
        ))}
      </tbody>
    </table>
  );
}
