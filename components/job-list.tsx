import Link from "next/link";
import { JobStatusTag } from "@/components/job-status";
import type { JobSummary } from "@/lib/server/jobs-repo";

// A plain list of jobs with one link each; used where a role picks a job to work on.
export function JobList({ jobs, hrefFor, empty }: { jobs: JobSummary[]; hrefFor: (j: JobSummary) => string; empty: string }) {
  if (!jobs.length) return <p className="rounded-tool border-2 border-dashed border-rule p-6 text-muted">{empty}</p>;
  return (
    <ul className="grid gap-3 md:grid-cols-2">
      {jobs.map((j) => (
        <li key={j.id}>
          <Link href={hrefFor(j)} className="flex min-h-24 flex-col gap-1 rounded-tool border-2 border-rule bg-panel p-4 hover:border-steel">
            <span className="flex items-center justify-between gap-2">
              <span className="font-mono text-sm text-muted">{j.code}</span>
              <JobStatusTag status={j.status} />
            </span>
            <span className="text-lg font-semibold">{j.title}</span>
            <span className="text-sm text-muted">
              {j.customer} · {j.engine} · {j.unitSystem === "in" ? "inch" : "metric"}
              {j.dueDate ? ` · due ${j.dueDate}` : ""}
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
