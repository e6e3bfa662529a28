"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useEffect, useRef } from "react";
import { FormProvider, useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { JOB_SIZES, JOB_SIZE_WORDS, lockedJobWords } from "@/lib/domain";
import { api } from "@/lib/client/api";
import { jobLimitsSchema, type JobLimitsInput, type JobLimitsValues } from "@/lib/schemas/spec";
import type { LimitsPreview, LimitsSaved } from "@/lib/schemas/job";
import { ChangeConfirm } from "./change-confirm";
import { Loading, LoadFailed, ServerError, applyFieldErrors } from "./fields";
import { keys, useJobLimits, type JobLimitsView } from "./queries";
import { JobSizesContext } from "./job-sizes-context";
import { SpecLimitsEditor } from "./spec-limits-editor";

// The job's own limits. Saving re-judges every current reading and derived value of the job on
// the server, in the same transaction, and opens or closes flags to match. Before it saves, the
// lead reads what the save will do (the server's preview) and confirms it.
/** The sizes limits that follow the job resolve from, and where to change them. */
function JobSizesLine({ view }: { view: JobLimitsView }) {
  const u = view.job.unitSystem;
  const parts = JOB_SIZES.map((size) => {
    const v = view.job.finishedSizes[size];
    return `${JOB_SIZE_WORDS[size].replace(/ size$/, "")} ${v === null ? "not stated" : `${v} ${u}`}`;
  });
  return (
    <p className="text-sm">
      Limits that follow the job use its {parts.join(", ")}.{" "}
      <a href={`/desk/jobs/${view.job.id}/edit`} className="font-semibold underline">
        Change them on the job
      </a>
      .
    </p>
  );
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

function LimitsForm({ view }: { view: JobLimitsView }) {
  const qc = useQueryClient();
  const id = view.job.id;
  const form = useForm<JobLimitsInput, unknown, JobLimitsValues>({
    resolver: zodResolver(jobLimitsSchema),
    defaultValues: { specRevision: view.job.specRevision, limits: view.limits },
  });
  const pending = useRef<JobLimitsValues | null>(null);
  const preview = useMutation({
    mutationFn: (v: JobLimitsValues) =>
      api<LimitsPreview>(`/api/jobs/${id}/limits/preview`, { method: "POST", json: v }),
    onError: (err) => applyFieldErrors(err, form.setError as never),
  });
  // Any edit after the preview makes it stale: the lead checks again.
  const resetPreview = preview.reset;
  useEffect(() => {
    const sub = form.watch(() => resetPreview());
    return () => sub.unsubscribe();
  }, [form, resetPreview]);
  const save = useMutation({
    mutationFn: (v: JobLimitsValues) => api<LimitsSaved>(`/api/jobs/${id}/limits`, { method: "PUT", json: v }),
    onSettled: () => preview.reset(),
    onSuccess: async (res) => {
      const { result: _r, consequences: _c, ...fresh } = res;
      qc.setQueryData(keys.limits(id), fresh);
      form.reset({ specRevision: res.job.specRevision, limits: res.limits });
      await Promise.all([
        qc.invalidateQueries({ queryKey: keys.job(id) }),
        qc.invalidateQueries({ queryKey: keys.jobs }),
        qc.invalidateQueries({ queryKey: ["flags"] }),
        qc.invalidateQueries({ queryKey: ["flag"] }),
      ]);
    },
    onError: (err) => applyFieldErrors(err, form.setError as never),
  });
  const r = save.data?.result;
  return (
    <FormProvider {...form}>
      <form
        noValidate
        onSubmit={form.handleSubmit((v) => {
          pending.current = v;
          save.reset();
          preview.mutate(v);
        })}
        className="flex flex-col gap-5"
      >
        <Notice title="Saving re-judges the job">
          Every current reading and computed value of this job is checked again against the limits you save. Flags open
          for values that fall outside and close for values now in spec; each change is in the audit trail with the
          limits before and after.
        </Notice>
        <JobSizesLine view={view} />
        <JobSizesContext.Provider value={{ sizes: view.job.finishedSizes, unit: view.job.unitSystem }}>
          <SpecLimitsEditor lengthUnit={view.job.unitSystem} />
        </JobSizesContext.Provider>
        {/* The outcome sits in the bar that stays on screen, beside the button that caused it. */}
        <div className="sticky bottom-0 flex flex-col gap-2 border-t-2 border-rule bg-paper py-3">
          <ServerError error={save.error ?? preview.error} />
          {form.formState.submitCount > 0 && !form.formState.isValid && (
            <p role="alert" className="font-medium text-fail">
              Some limits need fixing; each one says what to change.
            </p>
          )}
          {r && !form.formState.isDirty && (
            <p role="status" className="rounded-tool border-2 border-pass bg-pass-soft p-3 font-medium text-ink">
              Saved as revision {save.data!.job.specRevision}: {plural(r.reevaluated, "reading")} re-judged with a new
              result, {plural(r.opened, "flag")} opened, {plural(r.closed, "flag")} closed, {plural(r.updated, "flag")}{" "}
              updated.
            </p>
          )}
          {preview.data && pending.current && (
            <ChangeConfirm
              what="Saving these limits"
              preview={preview.data}
              saving={save.isPending}
              onConfirm={(n) => save.mutate({ ...pending.current!, confirmedFlagsOpened: n })}
              onCancel={() => preview.reset()}
            />
          )}
          <div className="flex gap-3">
            <Button type="submit" big disabled={save.isPending || preview.isPending || !!preview.data}>
              {preview.isPending ? "Working out what it changes…" : "Save limits"}
            </Button>
            <a
              href={`/desk/jobs/${id}`}
              className="inline-flex min-h-16 items-center rounded-tool border-2 border-rule bg-panel px-6 text-lg font-semibold"
            >
              Back to the job
            </a>
          </div>
        </div>
      </form>
    </FormProvider>
  );
}

export function JobLimitsEditor({ jobId }: { jobId: number }) {
  const q = useJobLimits(jobId);
  if (q.isPending) return <Loading what="the job's limits" />;
  if (q.isError) return <LoadFailed what="the job's limits" error={q.error} retry={() => q.refetch()} />;
  const { job } = q.data;
  return (
    <div className="flex flex-col gap-4">
      <div>
        <span className="font-mono text-sm text-muted">{job.code}</span>
        <h1 className="text-3xl font-semibold">Limits · {job.title}</h1>
        <p className="text-muted">
          Revision {job.specRevision}. These are the job&apos;s own limits; the spec sheet it started from is not
          changed.
        </p>
      </div>
      {job.locked ? <Notice title="Locked">{lockedJobWords(job, "its limits")}</Notice> : <LimitsForm view={q.data} />}
    </div>
  );
}
