"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { Fragment } from "react";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { Empty, LoadFailed, Loading } from "@/components/release/query-states";
import { Button } from "@/components/ui/button";
import { api, ApiError } from "@/lib/client/api";
import type { AuditFacets, AuditPage } from "@/lib/schemas/audit";
import { AuditChanges } from "./audit-changes";
import { AuditFilters, FILTER_KEYS, type Filters } from "./audit-filters";

// The audit trail for the lead and the inspector: filtered and paged on the server, newest first.
const PAGE_SIZE = 25;
const count = (n: number) => n.toLocaleString("en-US");

// A long trail is counted only a few thousand events past the page (the server says `more`): then
// the pages and events are "at least", and say so.
function pagesInWords(p: AuditPage): string {
  if (!p.more) return `Page ${p.page} of ${count(p.pages)} · ${count(p.total)} event${p.total === 1 ? "" : "s"}`;
  return `Page ${p.page} of more than ${count(p.pages)} · more than ${count(p.total)} events (not all counted)`;
}

function useFilters() {
  const params = useSearchParams();
  const router = useRouter();
  const path = usePathname();
  const filters = Object.fromEntries(FILTER_KEYS.map((k) => [k, params.get(k) ?? ""])) as Filters;
  const page = Math.max(1, Number(params.get("page")) || 1);
  const go = (f: Filters, p: number) => {
    const q = new URLSearchParams(Object.entries(f).filter(([, v]) => v));
    if (p > 1) q.set("page", String(p));
    router.replace(q.size ? `${path}?${q}` : path, { scroll: false });
  };
  return { filters, page, go };
}

/** An action name ("flag.machine_again") that may wrap after its dots and underscores, not mid-word. */
const breakable = (action: string) =>
  action.split(/(?<=[._])/).map((part, i) => (
    <Fragment key={i}>
      {i > 0 && <wbr />}
      {part}
    </Fragment>
  ));

// Below desktop width the date and time, the person and the record wrap in their cells, so the
// before → after column keeps its room on an 800-pixel tablet instead of running off the side.
function Table({ data }: { data: AuditPage }) {
  return (
    <div className="overflow-x-auto rounded-tool border-2 border-rule bg-panel">
      <table className="w-full text-left text-sm">
        <thead className="border-b-2 border-rule text-muted">
          <tr>
            <th className="p-2">When (UTC)</th>
            <th className="p-2">Who</th>
            <th className="p-2">Action</th>
            <th className="p-2">Record</th>
            <th className="p-2">Job</th>
            <th className="p-2">Before → after</th>
          </tr>
        </thead>
        <tbody>
          {data.events.map((e) => (
            <tr key={e.id} className="border-b border-rule align-top" data-event={e.id} data-action={e.action}>
              <td className="tabular p-2 font-mono text-xs">
                <span className="whitespace-nowrap">{e.at.slice(0, 10)}</span>{" "}
                <span className="whitespace-nowrap">{e.at.slice(11, 19)}</span>
              </td>
              <td className="p-2 lg:whitespace-nowrap">{e.userName ?? <span className="text-muted">System</span>}</td>
              <td className="p-2 font-mono text-xs font-semibold">{breakable(e.action)}</td>
              <td className="p-2 lg:whitespace-nowrap">
                {e.entityType}{" "}
                <span className="font-mono text-xs text-muted">
                  {e.entityId.length > 12 ? `${e.entityId.slice(0, 8)}…` : `#${e.entityId}`}
                </span>
              </td>
              <td className="whitespace-nowrap p-2">
                {e.jobId ? (
                  <Link
                    className="inline-flex min-h-11 items-center font-mono text-steel underline"
                    href={`/release/${e.jobId}`}
                  >
                    {e.jobCode}
                  </Link>
                ) : (
                  <span className="text-muted">—</span>
                )}
              </td>
              <td className="min-w-56 p-2 lg:min-w-72">
                <AuditChanges changes={e.changes} truncated={e.truncated} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function AuditBrowser() {
  const { filters, page, go } = useFilters();
  const query = new URLSearchParams({
    ...Object.fromEntries(Object.entries(filters).filter(([, v]) => v)),
    page: String(page),
    pageSize: String(PAGE_SIZE),
  });
  const facets = useQuery({ queryKey: ["audit-facets"], queryFn: () => api<AuditFacets>("/api/audit/facets") });
  const events = useQuery({
    queryKey: ["audit", query.toString()],
    queryFn: () => api<AuditPage>(`/api/audit?${query}`),
    placeholderData: keepPreviousData,
  });
  const fieldErrors = events.error instanceof ApiError ? events.error.fields : undefined;
  return (
    <div className="flex flex-col gap-4">
      <AuditFilters facets={facets.data} value={filters} onChange={(f) => go(f, 1)} error={fieldErrors} />
      {events.isPending ? (
        <Loading what="the audit trail" />
      ) : events.isError ? (
        <LoadFailed what="the audit trail" error={events.error} retry={() => events.refetch()} />
      ) : events.data.total === 0 ? (
        <Empty>No event matches these filters.</Empty>
      ) : (
        <>
          <Table data={events.data} />
          <nav aria-label="Pages" className="flex flex-wrap items-center gap-3">
            <Button tone="quiet" disabled={page <= 1} onClick={() => go(filters, page - 1)}>
              ← Newer
            </Button>
            <span className="text-sm" data-testid="audit-pages">
              {pagesInWords(events.data)}
            </span>
            <Button tone="quiet" disabled={page >= events.data.pages} onClick={() => go(filters, page + 1)}>
              Older →
            </Button>
            {events.isFetching && (
              <span className="text-sm text-muted" role="status">
                Updating…
              </span>
            )}
          </nav>
        </>
      )}
    </div>
  );
}
