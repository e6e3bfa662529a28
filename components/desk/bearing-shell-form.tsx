"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useForm, useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { api } from "@/lib/client/api";
import { BEARING_ROLE_WORDS } from "@/lib/domain";
import {
  BEARING_ROLES,
  SHELL_STEP_KINDS,
  STEP_KIND_WORDS,
  WALL_SOURCES,
  WALL_SOURCE_WORDS,
} from "@/lib/schemas/bearing-enums";
import { shellInputSchema, type BearingsView, type ShellInput } from "@/lib/schemas/bearings";
import { Field, NumberField, SelectField, ServerError, applyFieldErrors, asNumber, messageOf } from "./fields";
import { bearingsKey } from "./queries";

// One set of shells for the shelf: the series in the shop's own words, its role and size step,
// where its wall comes from, and the halves on hand. The form keeps what was typed when refused.

const EMPTY: ShellInput = {
  series: "",
  role: "main",
  step: "standard",
  wallSource: "nominal",
  halvesUpper: 0,
  halvesLower: 0,
};

export function ShellForm({ view, onDone }: { view: BearingsView; onDone?: () => void }) {
  const qc = useQueryClient();
  const unit = view.job.unit;
  const form = useForm<ShellInput>({ resolver: zodResolver(shellInputSchema), defaultValues: EMPTY });
  const { register, handleSubmit, setError, formState, control, reset } = form;
  const e = formState.errors;
  const [step, source] = useWatch({ control, name: ["step", "wallSource"] });
  const save = useMutation({
    mutationFn: (body: ShellInput) =>
      api<BearingsView>(`/api/jobs/${view.job.id}/bearings/shells`, { method: "POST", json: body }),
    onSuccess: (next) => {
      qc.setQueryData(bearingsKey(view.job.id), next);
      reset({ ...EMPTY, series: form.getValues("series"), role: form.getValues("role") });
      onDone?.();
    },
    onError: (err) => applyFieldErrors(err, setError),
  });
  const needsAmount = step === "thicker" || step === "thinner" || step === "undersize";
  return (
    <form
      aria-label="Add a set of shells"
      onSubmit={handleSubmit((v) => save.mutate(v))}
      className="flex flex-col gap-3 rounded-tool border-2 border-rule bg-panel p-4"
      noValidate
    >
      <h3 className="text-lg font-semibold">Add a set to the shelf</h3>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <Field label="Series (your own words)" error={messageOf(e.series ?? {})} {...register("series")} />
        <SelectField label="Fits" error={messageOf(e.role ?? {})} {...register("role")}>
          {BEARING_ROLES.map((r) => (
            <option key={r} value={r}>
              {BEARING_ROLE_WORDS[r]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Size step" error={messageOf(e.step ?? {})} {...register("step")}>
          {SHELL_STEP_KINDS.map((s) => (
            <option key={s} value={s}>
              {STEP_KIND_WORDS[s]}
            </option>
          ))}
        </SelectField>
        {needsAmount && (
          <NumberField
            label={step === "undersize" ? "Undersize" : `How much ${step} (full set)`}
            suffix={unit}
            error={messageOf(e.stepAmount ?? {})}
            {...register("stepAmount", asNumber)}
          />
        )}
        {step === "graded" && <Field label="Grade mark" error={messageOf(e.grade ?? {})} {...register("grade")} />}
        <SelectField
          label="Wall thickness from"
          error={messageOf(e.wallSource ?? {})}
          {...register("wallSource", { setValueAs: (v) => (v === "" ? null : v) })}
        >
          {needsAmount && <option value="">Derived from the standard set</option>}
          {WALL_SOURCES.map((w) => (
            <option key={w} value={w}>
              {WALL_SOURCE_WORDS[w]}
            </option>
          ))}
        </SelectField>
        {source === "nominal" && (
          <NumberField
            label="Wall, one half"
            suffix={unit}
            error={messageOf(e.wall ?? {})}
            {...register("wall", asNumber)}
          />
        )}
        {source === "range" && (
          <>
            <NumberField
              label="Smallest wall"
              suffix={unit}
              error={messageOf(e.wallMin ?? {})}
              {...register("wallMin", asNumber)}
            />
            <NumberField
              label="Largest wall"
              suffix={unit}
              error={messageOf(e.wallMax ?? {})}
              {...register("wallMax", asNumber)}
            />
          </>
        )}
        {source === "measured" && (
          <>
            <NumberField
              label="Upper half wall"
              suffix={unit}
              error={messageOf(e.wallUpper ?? {})}
              {...register("wallUpper", asNumber)}
            />
            <NumberField
              label="Lower half wall"
              suffix={unit}
              error={messageOf(e.wallLower ?? {})}
              {...register("wallLower", asNumber)}
            />
            <SelectField
              label="Ball micrometer"
              error={messageOf(e.wallGaugeId ?? {})}
              {...register("wallGaugeId", { setValueAs: (v) => (v === "" ? null : Number(v)) })}
            >
              <option value="">Pick the gauge</option>
              {view.gauges.map((g) => (
                <option key={g.id} value={g.id}>
                  {g.label}
                </option>
              ))}
            </SelectField>
          </>
        )}
        <NumberField
          label="Upper halves on hand"
          error={messageOf(e.halvesUpper ?? {})}
          {...register("halvesUpper", asNumber)}
        />
        <NumberField
          label="Lower halves on hand"
          error={messageOf(e.halvesLower ?? {})}
          {...register("halvesLower", asNumber)}
        />
      </div>
      <ServerError error={save.error} />
      <Button type="submit" disabled={save.isPending} className="self-start">
        {save.isPending ? "Adding…" : "Add to the shelf"}
      </Button>
    </form>
  );
}
