"use client";

import { flexRender, type Table } from "@tanstack/react-table";
import type { FlagListItem } from "@/lib/schemas/flag";

// The queue's table: headers sort on the server (the queue turns a click into ?sort=&dir=). A
// column's meta.className hides it below its screen width (flag-columns.tsx).
function SortMark({ dir }: { dir: false | "asc" | "desc" }) {
  if (!dir)
    return (
      <span aria-hidden="true" className="text-rule">
        ↕
      </span>
    );
  return <span aria-hidden="true">{dir === "asc" ? "▲" : "▼"}</span>;
}

export function FlagTable({ table }: { table: Table<FlagListItem> }) {
  return (
    <table className="w-full text-left" data-testid="flag-table">
      <thead className="bg-paper text-sm text-muted">
        {table.getHeaderGroups().map((hg) => (
          <tr key={hg.id}>
            {hg.headers.map((h) => (
              <th
                key={h.id}
                scope="col"
                className={`p-2 font-semibold ${h.column.columnDef.meta?.className ?? ""}`}
                aria-sort={
                  h.column.getIsSorted() ? (h.column.getIsSorted() === "asc" ? "ascending" : "descending") : undefined
                }
              >
                {h.column.getCanSort() ? (
                  <button
                    type="button"
                    className="inline-flex min-h-11 min-w-11 items-center gap-1 hover:text-ink"
                    onClick={h.column.getToggleSortingHandler()}
                  >
                    {flexRender(h.column.columnDef.header, h.getContext())} <SortMark dir={h.column.getIsSorted()} />
                  </button>
                ) : (
                  flexRender(h.column.columnDef.header, h.getContext())
                )}
              </th>
            ))}
          </tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((row) => (
          <tr key={row.id} className="border-t-2 border-rule align-top hover:bg-paper" data-flag-id={row.original.id}>
            {row.getVisibleCells().map((cell) => (
              <td key={cell.id} className={`p-2 ${cell.column.columnDef.meta?.className ?? ""}`}>
                {flexRender(cell.column.columnDef.cell, cell.getContext())}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
