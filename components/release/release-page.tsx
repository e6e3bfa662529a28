"use client";

import { JobStatusTag } from "@/components/job-status";
import { Notice } from "@/components/ui/notice";
import { lockWayOut, type JobStatus } from "@/lib/domain";
import { ChecklistPanel } from "./checklist-panel";
import { FlagsList } from "./flags-list";
import { LoadFailed, Loading } from "./query-states";
import { ReadingsSummary } from "./readings-summary";
import { ReleaseRecords } from "./release-record";
import { useReleaseView } from "./release-queries";
import { ReopenForm } from "./reopen-form";
import { SignForm } from "./sign-form";

// The inspector's release page (the lead sees it too, with the reopen form instead of signing).
export function ReleasePage({
  jobId,
  role,
  accountName,
}: {
  jobId: number;
  role: "inspector" | "lead";
  accountName: string;
}) {
  const q = useReleaseView(jobId);
  if (q.isPending) return <Loading what="the release checklist" />;
  if (q.isError) return <LoadFailed what="the release checklist" error={q.error} retry={() => q.refetch()} />;
  const v = q.data;
  const standing = v.releases.find((r) => r.status === "standing");
  return (
    <div className="flex flex-col gap-4">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <p className="font-mono text-sm text-muted">{v.job.code}</p>
          <h1 className="text-3xl font-semibold">{v.job.title}</h1>
          <p className="text-muted">
            {v.job.customer} · {v.job.engine} · {v.job.unitSystem === "mm" ? "metric" : "inch"}
          </p>
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <JobStatusTag status={v.job.status as JobStatus} />
          <a
            href={v.links.pdf}
            className="inline-flex min-h-11 items-center rounded-tool border-2 border-rule bg-panel px-4 font-semibold hover:border-steel"
          >
            Build record (PDF)
          </a>
          {v.links.verify && (
            <a
              href={v.links.verify}
              className="inline-flex min-h-11 items-center rounded-tool border-2 border-rule bg-panel px-4 font-semibold hover:border-steel"
            >
              Verification page
            </a>
          )}
        </div>
      </header>
      {v.job.lockedAt && (
        <Notice title={`Released and locked since ${v.job.lockedAt.slice(0, 10)}`}>
          Readings sent for this job are refused at sync; the tablet keeps them, marked with the reason.{" "}
          {lockWayOut("released")}
        </Notice>
      )}
      <div className="grid gap-4 lg:grid-cols-3">
        <div className="flex flex-col gap-4 lg:col-span-2">
          <ChecklistPanel checklist={v.checklist} />
          <FlagsList flags={v.flags} />
        </div>
        <div className="flex flex-col gap-4">
          <ReadingsSummary counts={v.counts} />
          {role === "inspector" && !standing && (
            <SignForm jobId={jobId} jobCode={v.job.code} accountName={accountName} ready={v.can.sign} />
          )}
          {role === "lead" && v.can.reopen && <ReopenForm jobId={jobId} jobCode={v.job.code} />}
          <ReleaseRecords jobId={jobId} jobCode={v.job.code} releases={v.releases} />
        </div>
      </div>
    </div>
  );
}
