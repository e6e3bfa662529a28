"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { useForm, type UseFormReturn } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { TextField } from "@/components/ui/text-field";
import { api, ApiError } from "@/lib/client/api";
import { INSTRUMENT_KIND_IDS, INSTRUMENT_KINDS, UNIT_WORDS, unitWords } from "@/lib/domain";
import {
  instrumentSchema,
  type InstrumentInput,
  type InstrumentRecord,
  type InstrumentValues,
} from "@/lib/schemas/instrument";

const FIELDS = [
  "kind",
  "label",
  "serial",
  "unit",
  "resolution",
  "expandedU",
  "rangeMin",
  "rangeMax",
  "calibratedOn",
  "calibrationDue",
  "dialPlusMeansSmaller",
] as const;
const select = "min-h-12 rounded-tool border-2 border-rule bg-paper px-3 text-lg";

function initial(g?: InstrumentRecord): InstrumentValues {
  if (!g)
    return {
      kind: "outside_mic",
      label: "",
      serial: "",
      unit: "in",
      resolution: Number.NaN,
      expandedU: Number.NaN,
      rangeMin: Number.NaN,
      rangeMax: Number.NaN,
      calibratedOn: "",
      calibrationDue: "",
      dialPlusMeansSmaller: true,
    };
  const { kind, label, serial, unit, resolution, expandedU, calibratedOn, calibrationDue, dialPlusMeansSmaller } = g;
  // A gauge registered before ranges were kept shows empty range fields, which the admin fills in.
  const range = { rangeMin: g.rangeMin ?? Number.NaN, rangeMax: g.rangeMax ?? Number.NaN };
  return {
    kind,
    label,
    serial,
    unit,
    resolution,
    expandedU,
    ...range,
    calibratedOn,
    calibrationDue,
    dialPlusMeansSmaller,
  };
}

/** Only for dial bore gauges: which way the dial reads, so the tablet turns a dial reading into a diameter. */
function DialSignField({ form }: { form: UseFormReturn<InstrumentValues, unknown, InstrumentInput> }) {
  return (
    <label className="flex items-start gap-3">
      <input type="checkbox" className="mt-1 h-6 w-6" {...form.register("dialPlusMeansSmaller")} />
      <span>
        <span className="font-medium">Plus on the dial means a smaller bore</span>
        <span className="block text-sm text-muted">
          Most dial bore gauges read plus when the bore is smaller than the size they were zeroed on. Untick it for a
          gauge that reads the other way; the tablet uses this to turn the dial reading into a diameter.
        </span>
      </span>
    </label>
  );
}

export function GaugeForm({ gauge, onDone }: { gauge?: InstrumentRecord; onDone: () => void }) {
  const qc = useQueryClient();
  const [serverError, setServerError] = useState<string | null>(null);
  const form = useForm<InstrumentValues, unknown, InstrumentInput>({
    resolver: zodResolver(instrumentSchema),
    defaultValues: initial(gauge),
  });
  const save = useMutation({
    mutationFn: (v: InstrumentInput) =>
      gauge
        ? api(`/api/instruments/${gauge.id}`, { method: "PATCH", json: v })
        : api("/api/instruments", { method: "POST", json: v }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: ["instruments"] });
      onDone();
    },
    onError: (err) => {
      // Keep everything typed; put the server's words on the fields it names.
      if (err instanceof ApiError && err.fields) {
        for (const [f, msgs] of Object.entries(err.fields))
          if ((FIELDS as readonly string[]).includes(f))
            form.setError(f as (typeof FIELDS)[number], { message: msgs[0] });
      }
      setServerError(
        err instanceof ApiError ? err.message : "Could not reach the server. Check the connection and try again.",
      );
    },
  });
  const kind = form.watch("kind");
  const unit = form.watch("unit");
  const e = form.formState.errors;
  const num = { valueAsNumber: true } as const;
  return (
    <form
      noValidate
      aria-label={gauge ? `Edit ${gauge.label}` : "Register a gauge"}
      onSubmit={form.handleSubmit((v) => {
        setServerError(null);
        save.mutate(v);
      })}
      className="flex flex-col gap-4 rounded-tool border-2 border-steel bg-panel p-4"
    >
      <h2 className="text-xl font-semibold">{gauge ? `Edit ${gauge.label}` : "Register a gauge"}</h2>
      {serverError && <Notice tone="error">{serverError}</Notice>}
      <div className="grid gap-4 md:grid-cols-3">
        <label className="flex flex-col gap-1.5">
          <span className="font-medium">Kind</span>
          <select className={select} {...form.register("kind")}>
            {INSTRUMENT_KIND_IDS.map((k) => (
              <option key={k} value={k}>
                {INSTRUMENT_KINDS[k].label}
              </option>
            ))}
          </select>
          {e.kind && <span className="text-sm font-medium text-fail">{e.kind.message}</span>}
        </label>
        <TextField
          label="Name"
          hint="What people call it, e.g. Outside micrometer 3–4 in"
          error={e.label?.message}
          {...form.register("label")}
        />
        <TextField label="Serial number" error={e.serial?.message} {...form.register("serial")} />
        <label className="flex flex-col gap-1.5">
          <span className="font-medium">Unit it reads</span>
          <select className={select} {...form.register("unit")}>
            {Object.entries(UNIT_WORDS).map(([u, w]) => (
              <option key={u} value={u}>
                {w}
              </option>
            ))}
          </select>
          {e.unit && <span className="text-sm font-medium text-fail">{e.unit.message}</span>}
        </label>
        <TextField
          label={`Resolution (${unitWords(unit)})`}
          inputMode="decimal"
          type="number"
          step="any"
          hint="Smallest step it shows"
          error={e.resolution?.message}
          {...form.register("resolution", num)}
        />
        <TextField
          label={`Expanded uncertainty U, k = 2 (${unitWords(unit)})`}
          type="number"
          step="any"
          inputMode="decimal"
          hint="From the calibration certificate (about 95 %). If it states another k, enter U × 2 ÷ k."
          error={e.expandedU?.message}
          {...form.register("expandedU", num)}
        />
        <TextField
          label={`Measures from (${unitWords(unit)})`}
          type="number"
          step="any"
          inputMode="decimal"
          hint="The smallest size or torque it reads, e.g. 4 for a 4–5 in micrometer"
          error={e.rangeMin?.message}
          {...form.register("rangeMin", num)}
        />
        <TextField
          label={`Measures up to (${unitWords(unit)})`}
          type="number"
          step="any"
          inputMode="decimal"
          hint="The largest it reads, e.g. 150 for a 20–150 lbf·ft torque wrench"
          error={e.rangeMax?.message}
          {...form.register("rangeMax", num)}
        />
        <TextField
          label="Calibrated on"
          type="date"
          error={e.calibratedOn?.message}
          {...form.register("calibratedOn")}
        />
        <TextField
          label="Calibration due"
          type="date"
          hint="Readings taken after this date are flagged"
          error={e.calibrationDue?.message}
          {...form.register("calibrationDue")}
        />
      </div>
      {kind === "bore_gauge_dial" && <DialSignField form={form} />}
      <div className="flex gap-3">
        <Button type="submit" disabled={save.isPending}>
          {save.isPending ? "Saving…" : gauge ? "Save changes" : "Register gauge"}
        </Button>
        <Button type="button" tone="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
