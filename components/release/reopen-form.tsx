"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useId, useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { ApiError } from "@/lib/client/api";
import { reopenSchema, type ReopenInput } from "@/lib/schemas/release";
import { useReopen } from "./release-queries";

// The lead reopens a released job, on the release page or the job page (one form, one route, the
// core's reopen rule). The reason goes on the record beside the word VOID; the job goes back to
// review and needs a new release; a customer who was sent the record is told by e-mail.
export function ReopenForm({
  jobId,
  jobCode,
  onReopened,
}: {
  jobId: number;
  jobCode: string;
  /** What else on screen to refresh (the job page's own queries). */
  onReopened?: () => unknown;
}) {
  const id = useId();
  const reopen = useReopen(jobId);
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<ReopenInput>({ resolver: zodResolver(reopenSchema), defaultValues: { reason: "" } });
  const error = form.formState.errors.reason?.message;

  const onSubmit = form.handleSubmit(async (values) => {
    setProblem(null);
    try {
      await reopen.mutateAsync(values);
      form.reset();
      await onReopened?.();
    } catch (err) {
      if (err instanceof ApiError && err.fields?.reason) form.setError("reason", { message: err.fields.reason[0] });
      setProblem(
        err instanceof ApiError ? err.message : "Could not reach the server; the job was not reopened. Try again.",
      );
    }
  });

  return (
    <section aria-labelledby={`${id}-h`} className="flex flex-col gap-3 rounded-tool border-2 border-fail bg-panel p-4">
      <h2 id={`${id}-h`} className="text-xl font-semibold">
        Reopen {jobCode}
      </h2>
      <p className="text-sm">
        Reopening voids the standing release. It stays on the record marked VOID with your reason, the readings unlock,
        and the inspector must release again. A customer who was sent the record gets an e-mail saying it is void and
        that a new one follows.
      </p>
      {problem && <Notice tone="error">{problem}</Notice>}
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
        <label htmlFor={id} className="flex flex-col gap-1.5">
          <span className="font-medium">Why is the job reopened?</span>
          <textarea
            id={id}
            rows={3}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${id}-err` : undefined}
            className={`rounded-tool border-2 bg-paper p-3 text-base ${error ? "border-fail" : "border-rule"}`}
            {...form.register("reason")}
          />
          {error && (
            <span id={`${id}-err`} className="text-sm font-medium text-fail">
              {error}
            </span>
          )}
        </label>
        <div>
          <Button type="submit" tone="danger" disabled={form.formState.isSubmitting}>
            {form.formState.isSubmitting ? "Reopening…" : "Reopen and void the release"}
          </Button>
        </div>
      </form>
    </section>
  );
}
