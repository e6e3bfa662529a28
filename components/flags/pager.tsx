"use client";

import { Button } from "@/components/ui/button";

export function Pager({
  page,
  pageCount,
  pageSize,
  total,
  onPage,
  onPageSize,
  what = "flags",
}: {
  page: number;
  pageCount: number;
  pageSize: number;
  total: number;
  onPage: (p: number) => void;
  onPageSize: (s: number) => void;
  /** What is counted, for "No flags" when there is none. */
  what?: string;
}) {
  const from = (page - 1) * pageSize + 1;
  const to = Math.min(total, page * pageSize);
  return (
    <nav aria-label="Pages" className="no-print flex flex-wrap items-center gap-3">
      <Button tone="quiet" disabled={page <= 1} onClick={() => onPage(page - 1)}>
        Previous
      </Button>
      <span className="tabular text-sm" data-testid="page-info">
        {total === 0 ? `No ${what}` : `${from}–${to} of ${total}`} · page {page} of {pageCount}
      </span>
      <Button tone="quiet" disabled={page >= pageCount} onClick={() => onPage(page + 1)}>
        Next
      </Button>
      <label className="ml-auto flex items-center gap-2 text-sm">
        Per page
        <select
          className="min-h-11 rounded-tool border-2 border-rule bg-paper px-2"
          value={pageSize}
          onChange={(e) => onPageSize(Number(e.target.value))}
        >
          {[10, 25, 50, 100].map((n) => (
            <option key={n} value={n}>
              {n}
            </option>
          ))}
        </select>
      </label>
    </nav>
  );
}
