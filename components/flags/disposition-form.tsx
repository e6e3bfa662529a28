"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { useForm, type UseFormReturn } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { api, ApiError } from "@/lib/client/api";
import { dispositionSchema, MACHINE_OPERATIONS, type DispositionInput } from "@/lib/schemas/flag";

// One form for the three decisions; the shared zod union decides which fields are needed.
type Values = { kind: DispositionInput["kind"]; note?: string; operation?: string; reason?: string };

const KINDS: { kind: Values["kind"]; title: string; words: string }[] = [
  {
    kind: "measure_again",
    title: "Measure again",
    words: "The station goes back on the machinist's route, marked, until a new reading comes in.",
  },
  {
    kind: "machine_again",
    title: "Machine again",
    words: "Name the operation; the station returns to the route to be measured after it.",
  },
  {
    kind: "accept",
    title: "Accept as is",
    words: "Only with a written reason. The verdict stays visible and the acceptance becomes part of the build record.",
  },
];

const area = "min-h-24 w-full rounded-tool border-2 bg-paper p-3 text-base";

/** The operation: the usual ones as one-tap choices, or anything the lead types. */
function OperationField({ form, error }: { form: UseFormReturn<Values, unknown, DispositionInput>; error?: string }) {
  return (
    <div className="flex flex-col gap-2">
      <label htmlFor="operation" className="font-medium">
        Operation
      </label>
      <div className="flex flex-wrap gap-2" role="group" aria-label="Common operations">
        {MACHINE_OPERATIONS.map((op) => (
          <button
            key={op}
            type="button"
            onClick={() => form.setValue("operation", op, { shouldValidate: true })}
            className="min-h-11 rounded-full border-2 border-rule px-3 text-sm font-medium hover:border-steel"
          >
            {op}
          </button>
        ))}
      </div>
      <input
        id="operation"
        className={`min-h-12 rounded-tool border-2 bg-paper px-3 text-lg ${error ? "border-fail" : "border-rule"}`}
        placeholder="Pick one above or type another"
        {...form.register("operation")}
      />
      {error && <span className="text-sm font-medium text-fail">{error}</span>}
    </div>
  );
}

export function DispositionForm({ flagId }: { flagId: number }) {
  const qc = useQueryClient();
  const [serverError, setServerError] = useState<string | null>(null);
  const form = useForm<Values, unknown, DispositionInput>({
    resolver: zodResolver(dispositionSchema) as never,
    defaultValues: { kind: "measure_again", note: "", operation: "", reason: "" },
  });
  const kind = form.watch("kind");
  const decide = useMutation({
    mutationFn: (v: DispositionInput) => api(`/api/flags/${flagId}/disposition`, { method: "POST", json: v }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: ["flag", flagId] });
      void qc.invalidateQueries({ queryKey: ["flags"] });
      form.reset({ kind: "measure_again", note: "", operation: "", reason: "" });
    },
    onError: (err) => {
      if (err instanceof ApiError && err.fields)
        for (const [f, m] of Object.entries(err.fields))
          if (f === "reason" || f === "operation" || f === "note") form.setError(f, { message: m[0] });
      setServerError(
        err instanceof ApiError ? err.message : "Could not reach the server. Nothing was recorded; try again.",
      );
    },
  });
  const e = form.formState.errors;
  return (
    <form
      id="decide"
      noValidate
      aria-label="Decide"
      onSubmit={form.handleSubmit((v) => {
        setServerError(null);
        decide.mutate(v);
      })}
      className="no-print flex flex-col gap-4 rounded-tool border-2 border-steel bg-panel p-4"
    >
      <h2 className="text-xl font-semibold">Decide</h2>
      {serverError && <Notice tone="error">{serverError}</Notice>}
      <fieldset className="grid gap-3 md:grid-cols-3">
        <legend className="sr-only">What to do</legend>
        {KINDS.map((k) => (
          <label
            key={k.kind}
            className={
              "flex cursor-pointer flex-col gap-1 rounded-tool border-2 p-3 " +
              (kind === k.kind ? "border-steel bg-paper" : "border-rule")
            }
          >
            <span className="flex items-center gap-2 text-lg font-semibold">
              <input type="radio" value={k.kind} className="h-5 w-5" {...form.register("kind")} />
              {k.title}
            </span>
            <span className="text-sm text-muted">{k.words}</span>
          </label>
        ))}
      </fieldset>
      {kind === "machine_again" && <OperationField form={form} error={e.operation?.message} />}
      {kind === "accept" ? (
        <label className="flex flex-col gap-1.5">
          <span className="font-medium">Why is it accepted as it is? (required)</span>
          <span className="text-sm text-muted">Printed on the customer&apos;s record beside the value.</span>
          <textarea className={`${area} ${e.reason ? "border-fail" : "border-rule"}`} {...form.register("reason")} />
          {e.reason && <span className="text-sm font-medium text-fail">{e.reason.message}</span>}
        </label>
      ) : (
        <label className="flex flex-col gap-1.5">
          <span className="font-medium">Note for the machinist (optional)</span>
          <span className="text-sm text-muted">It stays in the shop: never printed on the customer&apos;s record.</span>
          <textarea className={`${area} ${e.note ? "border-fail" : "border-rule"}`} {...form.register("note")} />
          {e.note && <span className="text-sm font-medium text-fail">{e.note.message}</span>}
        </label>
      )}
      <div>
        <Button type="submit" disabled={decide.isPending}>
          {decide.isPending ? "Recording…" : "Record decision"}
        </Button>
      </div>
    </form>
  );
}
