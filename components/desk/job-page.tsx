"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import type { ReactNode } from "react";
import { JobStatusTag, STATUS_WORDS } from "@/components/job-status";
import { Button } from "@/components/ui/button";
import { COMMON_PRACTICE_WORDS, EXPANSION_COEFFICIENTS, UNIT_SYSTEM_WORDS, type OpenJobStatus } from "@/lib/domain";
import { api } from "@/lib/client/api";
import { Loading, LoadFailed, ServerError } from "./fields";
import { editValuesOf } from "./job-form";
import { JobLockPanel } from "./job-lock-panel";
import { JobFinishedSizes } from "./job-finished-sizes";
import { JobSummary } from "./job-summary";
import { keys, useJob, type JobDetail } from "./queries";

// The job's desk page: who and what, where it stands, and the way to everything else about it.
/** The desk moves a job forward through the open statuses; release is the inspector's step. */
type NextStatus = Exclude<OpenJobStatus, "intake">;
const NEXT_STATUS: Record<string, { to: NextStatus; words: string } | undefined> = {
  intake: { to: "measuring", words: "Start measuring" },
  measuring: { to: "review", words: "Send to review" },
};
const materialWords = (m: string | null) =>
  m ? ((EXPANSION_COEFFICIENTS as Record<string, { label: string }>)[m]?.label ?? m) : "not recorded";
const btn =
  "inline-flex min-h-11 items-center rounded-tool border-2 border-rule bg-panel px-4 font-semibold hover:border-steel";

// A dl may hold only dt/dd groups, each group in one div: a wider fact takes its span itself.
function Fact({ label, children, className = "" }: { label: string; children: ReactNode; className?: string }) {
  return (
    <div className={`flex flex-col ${className}`}>
      <dt className="text-sm text-muted">{label}</dt>
      <dd className="font-medium">{children}</dd>
    </div>
  );
}

function Facts({ d }: { d: JobDetail }) {
  const e = d.engine;
  const u = d.job.unitSystem;
  return (
    <dl className="grid gap-4 rounded-tool border-2 border-rule bg-panel p-4 sm:grid-cols-2 lg:grid-cols-4">
      <Fact label="Customer">
        {d.customer.name}
        {d.customer.email && <span className="block text-sm text-muted">{d.customer.email}</span>}
        {d.customer.phone && <span className="block text-sm text-muted">{d.customer.phone}</span>}
      </Fact>
      <Fact label="Engine">
        {e.description}
        <span className="block text-sm text-muted">
          {e.cylinders} cylinders, {e.layout === "v" ? "V" : e.layout}, {e.mains} mains, {e.valvesPerCylinder} valves a
          cylinder
        </span>
      </Fact>
      <Fact label="Nominal bore × stroke">
        <span className="tabular">
          {e.nominalBore} × {e.nominalStroke} {u}
        </span>
      </Fact>
      <Fact label="Finished sizes">
        <JobFinishedSizes d={d} />
      </Fact>
      <Fact label="Units">{UNIT_SYSTEM_WORDS[u]}</Fact>
      <Fact label="Materials">
        <span className="block">Block: {materialWords(e.blockMaterial)}</span>
        <span className="block text-sm text-muted">Head: {materialWords(e.headMaterial)}</span>
        <span className="block text-sm text-muted">Pistons: {materialWords(e.pistonMaterial)}</span>
      </Fact>
      <Fact label="Serials">
        <span className="block text-sm">
          Block <span className="font-mono">{e.blockSerial ?? "not recorded"}</span>
        </span>
        <span className="block text-sm">
          Crank <span className="font-mono">{e.crankSerial ?? "not recorded"}</span>
        </span>
        <span className="block text-sm">
          Heads <span className="font-mono">{e.headSerials ?? "not recorded"}</span>
        </span>
      </Fact>
      <Fact label="Spec sheet">
        {d.job.templateName ?? "Template since deleted"}
        <span className="block text-sm text-muted">
          {d.job.limitCount} limits on the job · revision {d.job.specRevision}
        </span>
        {d.job.commonPracticeCount > 0 && (
          <span className="mt-1 block rounded-tool border-l-4 border-watch bg-watch-soft p-2 text-sm">
            {d.job.commonPracticeCount} of them: {COMMON_PRACTICE_WORDS.toLowerCase()}
          </span>
        )}
      </Fact>
      <Fact label="Due">{d.job.dueDate ?? "No date"}</Fact>
      {d.job.notes && (
        <Fact label="Notes" className="sm:col-span-2 lg:col-span-4">
          <span className="whitespace-pre-line">{d.job.notes}</span>
        </Fact>
      )}
    </dl>
  );
}

function StatusMove({ d }: { d: JobDetail }) {
  const qc = useQueryClient();
  const next = NEXT_STATUS[d.job.status];
  const move = useMutation({
    mutationFn: (status: NextStatus) =>
      api<JobDetail>(`/api/jobs/${d.job.id}`, { method: "PATCH", json: { ...editValuesOf(d), status } }),
    onSuccess: (res) => {
      qc.setQueryData(keys.job(d.job.id), res);
      return qc.invalidateQueries({ queryKey: keys.jobs });
    },
  });
  if (!next) return null;
  return (
    <>
      <Button
        onClick={() => move.mutate(next.to)}
        disabled={move.isPending}
        title={`Status becomes “${STATUS_WORDS[next.to]}”`}
      >
        {move.isPending ? "Saving…" : next.words}
      </Button>
      {move.error && (
        <div className="w-full">
          <ServerError error={move.error} />
        </div>
      )}
    </>
  );
}

function Links({ d, canEdit }: { d: JobDetail; canEdit: boolean }) {
  const id = d.job.id;
  const f = d.flags;
  return (
    <nav aria-label="About this job" className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
      <Link
        className="flex flex-col rounded-tool border-2 border-rule bg-panel p-4 hover:border-steel"
        href={`/desk/flags?job=${id}`}
      >
        <span className="text-lg font-semibold">Flags</span>
        <span className="text-sm text-muted">
          {f.open} open · {f.disposed} awaiting re-check · {f.closed} closed
        </span>
      </Link>
      <Link
        className="flex flex-col rounded-tool border-2 border-rule bg-panel p-4 hover:border-steel"
        href={`/desk/jobs/${id}/maps`}
      >
        <span className="text-lg font-semibold">Bore and journal maps</span>
        <span className="text-sm text-muted">Diameter by depth and axis, taper and out-of-round, deck corners</span>
      </Link>
      {canEdit && (
        <Link
          className="flex flex-col rounded-tool border-2 border-rule bg-panel p-4 hover:border-steel"
          href={`/desk/jobs/${id}/plan`}
        >
          <span className="text-lg font-semibold">Build plan</span>
          <span className="text-sm text-muted">
            {d.job.hasBuildPlan ? "Displacement, compression, deck and valve lift" : "Not entered yet"}
          </span>
        </Link>
      )}
      {canEdit && (
        <Link
          className="flex flex-col rounded-tool border-2 border-rule bg-panel p-4 hover:border-steel"
          href={`/desk/jobs/${id}/bearings`}
        >
          <span className="text-lg font-semibold">Bearing shells</span>
          <span className="text-sm text-muted">Shells on the shelf, halves per journal, pick list</span>
        </Link>
      )}
      {canEdit && (
        <Link
          className="flex flex-col rounded-tool border-2 border-rule bg-panel p-4 hover:border-steel"
          href={`/desk/jobs/${id}/limits`}
        >
          <span className="text-lg font-semibold">Limits</span>
          <span className="text-sm text-muted">
            {d.job.limitCount} limits · revision {d.job.specRevision}
            {d.job.locked ? " · locked" : ""}
          </span>
        </Link>
      )}
      <div className="flex flex-col gap-1 rounded-tool border-2 border-rule bg-panel p-4">
        <span className="text-lg font-semibold">Export</span>
        <a
          className="inline-flex min-h-11 items-center font-medium text-steel underline"
          href={`/api/jobs/${id}/readings.csv`}
          download
        >
          Current readings and computed values (CSV)
        </a>
        <a
          className="inline-flex min-h-11 items-center text-sm text-steel underline"
          href={`/api/jobs/${id}/readings.csv?history=1`}
          download
        >
          With earlier readings (CSV)
        </a>
      </div>
    </nav>
  );
}

export function JobPage({ jobId, role }: { jobId: number; role: string }) {
  const canEdit = role === "lead";
  const job = useJob(jobId);
  if (job.isPending) return <Loading what="the job" />;
  if (job.isError) return <LoadFailed what="the job" error={job.error} retry={() => job.refetch()} />;
  const d = job.data;
  const editable = canEdit && !d.job.locked;
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div className="flex flex-col gap-1">
          <span className="font-mono text-sm text-muted">{d.job.code}</span>
          <h1 className="text-3xl font-semibold">{d.job.title}</h1>
          <span>
            <JobStatusTag status={d.job.status} />
          </span>
        </div>
        {editable && (
          <div className="flex flex-wrap gap-2">
            <StatusMove d={d} />
            <Link className={btn} href={`/desk/jobs/${jobId}/edit`}>
              Edit job
            </Link>
          </div>
        )}
      </div>
      <JobLockPanel d={d} role={role} />
      <Facts d={d} />
      <Links d={d} canEdit={canEdit} />
      <JobSummary summary={d.summary} />
    </div>
  );
}
