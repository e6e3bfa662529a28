"use client";

import Link from "next/link";
import { StatusTag } from "@/components/admin/status-tag";
import { JobStatusTag } from "@/components/job-status";
import type { JobStatus } from "@/lib/domain";
import { Empty, LoadFailed, Loading } from "./query-states";
import { useReleaseJobs } from "./release-queries";

// The inspector's home: every open job with whether it can be signed, and the released ones.
export function ReleaseBoard() {
  const q = useReleaseJobs();
  if (q.isPending) return <Loading what="the jobs" />;
  if (q.isError) return <LoadFailed what="the jobs" error={q.error} retry={() => q.refetch()} />;
  if (!q.data.length) return <Empty>No blocks are waiting for release.</Empty>;
  const order = (j: (typeof q.data)[number]) => (j.release ? 2 : j.complete ? 0 : 1);
  const jobs = [...q.data].sort((a, b) => order(a) - order(b));
  return (
    <ul className="grid gap-3 md:grid-cols-2">
      {jobs.map((j) => (
        <li key={j.id}>
          <Link
            href={`/release/${j.id}`}
            className="flex min-h-24 flex-col gap-2 rounded-tool border-2 border-rule bg-panel p-4 hover:border-steel"
            data-job={j.code}
          >
            <span className="flex items-center justify-between gap-2">
              <span className="font-mono text-sm text-muted">{j.code}</span>
              <JobStatusTag status={j.status as JobStatus} />
            </span>
            <span className="text-lg font-semibold">{j.title}</span>
            <span className="text-sm text-muted">
              {j.customer} · {j.engine}
              {j.dueDate ? ` · due ${j.dueDate}` : ""}
            </span>
            <span>
              {j.release ? (
                <StatusTag tone="good">Released {j.release.signedAt.slice(0, 10)}</StatusTag>
              ) : j.complete ? (
                <StatusTag tone="good">Ready to sign</StatusTag>
              ) : (
                <StatusTag tone="bad">
                  {j.unmet} {j.unmet === 1 ? "item blocks" : "items block"} release
                </StatusTag>
              )}
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
