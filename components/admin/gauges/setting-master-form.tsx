"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { api, ApiError } from "@/lib/client/api";
import { unitWords } from "@/lib/domain";
import type { InstrumentRecord } from "@/lib/schemas/instrument";
import {
  settingMasterSchemaFor,
  type SettingMasterInput,
  type SettingMasterValues,
} from "@/lib/schemas/setting-master";

// The gauge's setting master: the ring or gauge block a repeatability study on the tablet offers as its
// reference. The admin sets, changes or removes it; lead and inspector read it. Verdicts never use it.
const FIELDS = ["label", "size", "expandedU"] as const;

function MasterLine({ gauge }: { gauge: InstrumentRecord }) {
  const m = gauge.master;
  const unit = unitWords(gauge.unit);
  if (!m) return <p data-testid="master-line">None on file: each study&apos;s reference is typed on the tablet.</p>;
  return (
    <p data-testid="master-line">
      <span className="font-medium">{m.label ?? "Unnamed master"}</span>
      <span className="tabular">
        {" "}
        · size {m.size} {unit} · certificate&apos;s U {m.expandedU} {unit} (k = 2)
      </span>
    </p>
  );
}

const blank = (g: InstrumentRecord): SettingMasterValues => ({
  label: g.master?.label ?? "",
  size: g.master?.size ?? Number.NaN,
  expandedU: g.master?.expandedU ?? Number.NaN,
});

export function SettingMasterForm({ gauge, canEdit }: { gauge: InstrumentRecord; canEdit: boolean }) {
  const qc = useQueryClient();
  const [said, setSaid] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [removing, setRemoving] = useState(false);
  const form = useForm<SettingMasterValues, unknown, SettingMasterInput>({
    resolver: zodResolver(settingMasterSchemaFor(gauge)),
    defaultValues: blank(gauge),
  });
  const done = (words: string) => (r: { instrument: InstrumentRecord }) => {
    setSaid(words);
    setError(null);
    setRemoving(false);
    form.reset(blank(r.instrument));
    qc.setQueryData(["instrument", gauge.id], r);
  };
  const failed = (err: Error) => {
    // Keep everything typed; put the server's words on the fields it names.
    if (err instanceof ApiError && err.fields)
      for (const [f, msgs] of Object.entries(err.fields))
        if ((FIELDS as readonly string[]).includes(f))
          form.setError(f as (typeof FIELDS)[number], { message: msgs[0] });
    setError(err instanceof ApiError ? err.message : "Could not reach the server; nothing was changed. Try again.");
  };
  const url = `/api/instruments/${gauge.id}/master`;
  const save = useMutation({
    mutationFn: (m: SettingMasterInput) => api<{ instrument: InstrumentRecord }>(url, { method: "PUT", json: m }),
    onSuccess: done("Saved. The tablet offers this master on the next study of this gauge."),
    onError: failed,
  });
  const remove = useMutation({
    mutationFn: () => api<{ instrument: InstrumentRecord }>(url, { method: "DELETE" }),
    onSuccess: done("Removed. A study of this gauge now takes its reference as typed on the tablet."),
    onError: failed,
  });
  const unit = unitWords(gauge.unit);
  const errors = form.formState.errors;
  return (
    <section aria-labelledby="master-h" className="max-w-3xl rounded-tool border-2 border-rule bg-panel p-4">
      <h2 id="master-h" className="text-xl font-semibold">
        Setting master
      </h2>
      <MasterLine gauge={gauge} />
      {canEdit && (
        <form
          className="mt-3 flex flex-col gap-3"
          noValidate
          aria-label="Setting master"
          onSubmit={form.handleSubmit((v) => {
            setSaid(null);
            save.mutate(v);
          })}
        >
          <div className="grid gap-3 sm:grid-cols-3">
            <TextField
              label="Name as marked"
              hint="e.g. Ring 4.0300"
              error={errors.label?.message}
              {...form.register("label")}
            />
            <TextField
              label={`Size (${unit})`}
              hint="From its certificate"
              inputMode="decimal"
              error={errors.size?.message}
              {...form.register("size", { setValueAs: toNumber })}
            />
            <TextField
              label={`Certificate's U (${unit}, k = 2)`}
              hint="Expanded uncertainty"
              inputMode="decimal"
              error={errors.expandedU?.message}
              {...form.register("expandedU", { setValueAs: toNumber })}
            />
          </div>
          <div className="flex flex-wrap items-center gap-3">
            <Button type="submit" disabled={save.isPending}>
              {gauge.master ? "Save the changed master" : "Put this master on file"}
            </Button>
            {gauge.master && !removing && (
              <Button type="button" tone="quiet" onClick={() => setRemoving(true)}>
                Remove the master
              </Button>
            )}
          </div>
          {removing && (
            <div role="group" aria-label="Confirm removal" className="flex flex-wrap items-center gap-3">
              <span>
                Remove {gauge.master?.label ?? "the master"}? Studies then take the reference typed on the tablet.
              </span>
              <Button type="button" tone="danger" disabled={remove.isPending} onClick={() => remove.mutate()}>
                Yes, remove it
              </Button>
              <Button type="button" tone="quiet" onClick={() => setRemoving(false)}>
                Keep it
              </Button>
            </div>
          )}
          {said && <p role="status">{said}</p>}
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

/** An empty or unreadable field becomes NaN, which the schema refuses with its own words. */
function toNumber(v: unknown): number {
  if (typeof v === "number") return v;
  const text = String(v ?? "").trim();
  return text === "" ? Number.NaN : Number(text);
}
