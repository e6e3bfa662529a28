"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { TextField } from "@/components/ui/text-field";
import { api, ApiError } from "@/lib/client/api";
import { studySettingsSchema, type StudySettings } from "@/lib/schemas/gauge-studies";

// The shop's pass marks for gauge studies. The admin edits them; the lead and inspector read them.
// A kept study keeps the marks it was judged by, so a change applies to the studies saved after it.
const FIELDS: { name: keyof StudySettings; label: string; hint: string; step: string }[] = [
  { name: "minCg", label: "Least Cg", hint: "Common practice: 1.33", step: "0.01" },
  { name: "minCgk", label: "Least Cgk", hint: "Common practice: 1.33", step: "0.01" },
  { name: "maxResolutionPct", label: "Largest gauge step, % of T", hint: "Common practice: 5", step: "0.01" },
  { name: "maxGrrPct", label: "Largest %GRR", hint: "Common practice: 10 good, 30 at most", step: "0.01" },
  { name: "validMonths", label: "Months a study stays current", hint: "Like a calibration interval", step: "1" },
];

export function StudySettingsForm({ canEdit }: { canEdit: boolean }) {
  const qc = useQueryClient();
  const [saved, setSaved] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const current = useQuery({
    queryKey: ["study-settings"],
    queryFn: () => api<{ settings: StudySettings }>("/api/admin/study-settings"),
  });
  const form = useForm<StudySettings>({ resolver: zodResolver(studySettingsSchema) });
  const { reset } = form;
  useEffect(() => {
    if (current.data) reset(current.data.settings);
  }, [current.data, reset]);
  const save = useMutation({
    mutationFn: (next: StudySettings) => api("/api/admin/study-settings", { method: "PUT", json: next }),
    onSuccess: () => {
      setSaved(true);
      setError(null);
      void qc.invalidateQueries({ queryKey: ["study-settings"] });
    },
    onError: (err) => setError(err instanceof ApiError ? err.message : "Could not reach the server; try again."),
  });
  const errors = form.formState.errors;
  return (
    <section aria-labelledby="study-marks-h" className="rounded-tool border-2 border-rule bg-panel p-4">
      <h2 id="study-marks-h" className="text-xl font-semibold">
        Pass marks for gauge studies
      </h2>
      <p className="mb-3 text-sm text-muted">
        Each study keeps the marks it was judged by; a change here applies to studies saved from now on.
      </p>
      {current.isError && (
        <Notice tone="error" title="Could not load the pass marks">
          {current.error.message}
        </Notice>
      )}
      {current.data && (
        <form
          className="flex flex-col gap-3"
          onSubmit={form.handleSubmit((v) => {
            setSaved(false);
            save.mutate(v);
          })}
        >
          <fieldset disabled={!canEdit} className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5">
            {FIELDS.map((f) => (
              <TextField
                key={f.name}
                label={f.label}
                hint={f.hint}
                type="number"
                inputMode="decimal"
                step={f.step}
                error={errors[f.name]?.message}
                {...form.register(f.name, { valueAsNumber: true })}
              />
            ))}
          </fieldset>
          {canEdit && (
            <div className="flex flex-wrap items-center gap-3">
              <Button type="submit" disabled={save.isPending}>
                Save the pass marks
              </Button>
              {saved && <span role="status">Saved. Studies from now on are judged by these marks.</span>}
            </div>
          )}
          {error && (
            <p role="alert" className="text-sm font-medium text-fail">
              {error}
            </p>
          )}
        </form>
      )}
    </section>
  );
}
