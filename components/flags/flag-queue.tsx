"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { getCoreRowModel, useReactTable, type SortingState } from "@tanstack/react-table";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useMemo } from "react";
import { Notice } from "@/components/ui/notice";
import { api } from "@/lib/client/api";
import { flagListQuerySchema, type FlagListQuery, type FlagPage } from "@/lib/schemas/flag";
import { flagColumns } from "./flag-columns";
import { FlagFilters, type JobOption } from "./flag-filters";
import { FlagTable } from "./flag-table";
import { Pager } from "./pager";

// The queue's state lives in the URL (?job=12&state=open&sort=age…), so a job page can link
// straight to its flags and the back button returns to the same view.
function readQuery(params: URLSearchParams): FlagListQuery {
  const parsed = flagListQuerySchema.safeParse(Object.fromEntries(params));
  return parsed.success ? parsed.data : flagListQuerySchema.parse({});
}

function toParams(q: FlagListQuery): string {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(q)) if (v !== undefined) p.set(k, String(v));
  return p.toString();
}

export function FlagQueue({ jobs }: { jobs: JobOption[] }) {
  const router = useRouter();
  const pathname = usePathname();
  const search = useSearchParams();
  const q = useMemo(() => readQuery(new URLSearchParams(search.toString())), [search]);
  const set = (patch: Partial<FlagListQuery>) =>
    router.replace(`${pathname}?${toParams({ ...q, page: 1, ...patch })}`, { scroll: false });
  const flags = useQuery({
    queryKey: ["flags", toParams(q)],
    queryFn: () => api<FlagPage>(`/api/flags?${toParams(q)}`),
    placeholderData: keepPreviousData,
  });
  const sorting: SortingState = [{ id: q.sort, desc: q.dir === "desc" }];
  const table = useReactTable({
    data: flags.data?.items ?? [],
    columns: flagColumns,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    rowCount: flags.data?.total ?? 0,
    state: { sorting, pagination: { pageIndex: q.page - 1, pageSize: q.pageSize } },
    onSortingChange: (updater) => {
      const next = typeof updater === "function" ? updater(sorting) : updater;
      const first = next[0];
      set(
        first
          ? { sort: first.id as FlagListQuery["sort"], dir: first.desc ? "desc" : "asc" }
          : { sort: "age", dir: "desc" },
      );
    },
    enableSortingRemoval: false,
  });
  const page = flags.data;
  return (
    <div className="flex flex-col gap-4">
      <FlagFilters value={q} jobs={jobs} onChange={set} />
      {flags.isError && (
        <Notice tone="error" title="Could not load the flags">
          {flags.error.message} Try again in a moment.
        </Notice>
      )}
      <div className="overflow-x-auto rounded-tool border-2 border-rule bg-panel" aria-busy={flags.isFetching}>
        <FlagTable table={table} />
        {flags.isPending && <p className="p-4 text-muted">Loading flags…</p>}
        {page && page.total === 0 && (
          <p className="p-6 text-muted" data-testid="flags-empty">
            No flags match these filters.
            {q.state === "active" ? " Every reading so far is in spec or closed." : " Try another state or job."}
          </p>
        )}
      </div>
      {page && page.total > 0 && (
        <Pager
          page={page.page}
          pageCount={page.pageCount}
          pageSize={page.pageSize}
          total={page.total}
          onPage={(p) => set({ page: p })}
          onPageSize={(s) => set({ pageSize: s })}
        />
      )}
    </div>
  );
}
