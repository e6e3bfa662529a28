"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { useForm, useWatch, type UseFormRegister, type FieldErrors } from "react-hook-form";
import { planFigures } from "@/components/desk/plan-figures";
import { PlanFitWarnings } from "@/components/desk/plan-fit";
import { PlanResults } from "@/components/desk/plan-results";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { lockedJobWords } from "@/lib/domain";
import { api } from "@/lib/client/api";
import { planFitWarnings } from "@/lib/domain";
import { buildPlanSchema, pistonCcOf, type BuildPlan, type BuildPlanInput } from "@/lib/schemas/build-plan";
import {
  AreaField,
  Loading,
  LoadFailed,
  NumberField,
  SelectField,
  ServerError,
  applyFieldErrors,
  asNumber,
  messageOf,
} from "./fields";
import { keys, useBuildPlan, type BuildPlanView } from "./queries";

// The build plan: the combination on the left, the core's figures on the right, live as the
// lead types; saved on the job with its units.
type NumKey =
  | "bore"
  | "stroke"
  | "rodLength"
  | "compressionHeight"
  | "deckHeight"
  | "chamberCc"
  | "pistonVolumeCc"
  | "gasketBore"
  | "gasketThickness"
  | "intakeLobeLift"
  | "exhaustLobeLift"
  | "rockerRatio"
  | "intakeLash"
  | "exhaustLash";

function startValues(v: BuildPlanView): BuildPlanInput {
  if (v.plan) return v.plan;
  return {
    lengthUnit: v.job.unitSystem,
    bore: v.job.finishedBore ?? v.engine.nominalBore,
    stroke: v.engine.nominalStroke,
    pistonTop: "flat",
    rodLength: null,
    compressionHeight: null,
    pistonVolumeCc: null,
    chamberCc: null,
    gasketBore: null,
    gasketThickness: null,
    deckHeight: null,
    intakeLobeLift: null,
    exhaustLobeLift: null,
    rockerRatio: null,
    intakeLash: null,
    exhaustLash: null,
    notes: "",
  };
}

function Num({
  k,
  label,
  unit,
  hint,
  register,
  errors,
}: {
  k: NumKey;
  label: string;
  unit: string;
  hint?: string;
  register: UseFormRegister<BuildPlanInput>;
  errors: FieldErrors<BuildPlanInput>;
}) {
  return (
    <NumberField label={label} suffix={unit} hint={hint} error={messageOf(errors[k])} {...register(k, asNumber)} />
  );
}

function PlanForm({ view }: { view: BuildPlanView }) {
  const qc = useQueryClient();
  const unit = view.job.unitSystem;
  const form = useForm<BuildPlanInput, unknown, BuildPlan>({
    resolver: zodResolver(buildPlanSchema),
    defaultValues: startValues(view),
    mode: "onChange",
  });
  const values = useWatch({ control: form.control }) as BuildPlanInput;
  const figures = planFigures({ ...values, lengthUnit: unit }, view.engine.cylinders);
  const save = useMutation({
    mutationFn: (p: BuildPlan) => api<BuildPlanView>(`/api/jobs/${view.job.id}/build-plan`, { method: "PUT", json: p }),
    onSuccess: async (res) => {
      qc.setQueryData(keys.plan(view.job.id), res);
      form.reset(startValues(res));
      await qc.invalidateQueries({ queryKey: keys.job(view.job.id) });
    },
    onError: (err) => applyFieldErrors(err, form.setError as never),
  });
  const {
    register,
    formState: { errors, isDirty },
  } = form;
  const f = { register, errors };
  const piston = values.pistonTop ?? "flat";
  const pistonCc = pistonCcOf({ pistonTop: piston, pistonVolumeCc: values.pistonVolumeCc });
  // Parts that do not fit are a warning, not a refusal: shown as the lead types, asked once more on save.
  const warnings = planFitWarnings({ ...values, lengthUnit: unit, pistonCc });
  const [askFit, setAskFit] = useState<BuildPlan | null>(null);
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_26rem]">
      <form
        noValidate
        onSubmit={form.handleSubmit((p) => (warnings.length ? setAskFit(p) : save.mutate(p)))}
        onChange={() => setAskFit(null)}
        className="flex flex-col gap-5"
      >
        <input type="hidden" {...register("lengthUnit")} />
        <fieldset
          disabled={view.job.locked}
          className="grid gap-4 rounded-tool border-2 border-rule bg-panel p-4 sm:grid-cols-2"
        >
          <legend className="px-1 text-lg font-semibold">Crank, rod, piston and block</legend>
          <Num k="bore" label="Bore (finished)" unit={unit} {...f} />
          <Num k="stroke" label="Stroke" unit={unit} {...f} />
          <Num k="rodLength" label="Rod length, centre to centre" unit={unit} {...f} />
          <Num k="compressionHeight" label="Piston compression height" unit={unit} hint="Pin centre to crown" {...f} />
          <Num k="deckHeight" label="Block deck height" unit={unit} hint="Crank centre line to deck" {...f} />
        </fieldset>
        <fieldset
          disabled={view.job.locked}
          className="grid gap-4 rounded-tool border-2 border-rule bg-panel p-4 sm:grid-cols-2"
        >
          <legend className="px-1 text-lg font-semibold">Volumes and gasket</legend>
          <Num k="chamberCc" label="Chamber volume" unit="cc" hint="0 for a flat head or a bowl in the piston" {...f} />
          <SelectField label="Piston top" error={messageOf(errors.pistonTop)} {...register("pistonTop")}>
            <option value="flat">Flat top (0 cc)</option>
            <option value="dish">Dish (adds volume)</option>
            <option value="dome">Dome (takes volume away)</option>
          </SelectField>
          {piston !== "flat" && (
            <Num
              k="pistonVolumeCc"
              label={piston === "dish" ? "Dish volume" : "Dome volume"}
              unit="cc"
              hint="As a size; the dish adds it, the dome takes it away"
              {...f}
            />
          )}
          <Num k="gasketBore" label="Gasket bore" unit={unit} {...f} />
          <Num k="gasketThickness" label="Gasket thickness, compressed" unit={unit} {...f} />
        </fieldset>
        <fieldset
          disabled={view.job.locked}
          className="grid gap-4 rounded-tool border-2 border-rule bg-panel p-4 sm:grid-cols-2"
        >
          <legend className="px-1 text-lg font-semibold">Valve train</legend>
          <Num k="intakeLobeLift" label="Intake lobe lift" unit={unit} {...f} />
          <Num k="exhaustLobeLift" label="Exhaust lobe lift" unit={unit} {...f} />
          <Num k="rockerRatio" label="Rocker ratio" unit=": 1" hint="e.g. 1.5" {...f} />
          <span className="hidden sm:block" />
          <Num k="intakeLash" label="Intake lash" unit={unit} hint="0 for hydraulic lifters" {...f} />
          <Num k="exhaustLash" label="Exhaust lash" unit={unit} hint="0 for hydraulic lifters" {...f} />
          <AreaField
            wrapClass="sm:col-span-2"
            label="Notes"
            rows={2}
            error={messageOf(errors.notes)}
            {...register("notes")}
          />
        </fieldset>
        <PlanFitWarnings
          warnings={warnings}
          asking={!!askFit}
          saving={save.isPending}
          onSave={() => {
            if (askFit) save.mutate(askFit);
            setAskFit(null);
          }}
          onCancel={() => setAskFit(null)}
        />
        <ServerError error={save.error} />
        {save.isSuccess && !isDirty && (
          <p role="status" className="font-medium text-pass">
            Plan saved on the job.
          </p>
        )}
        {!view.job.locked && (
          <div>
            <Button type="submit" big disabled={save.isPending}>
              {save.isPending ? "Saving…" : "Save plan"}
            </Button>
          </div>
        )}
      </form>
      <div className="lg:sticky lg:top-4 lg:self-start">
        <PlanResults
          f={figures}
          unit={unit}
          inputs={{
            gasketThickness: values.gasketThickness,
            chamberCc: values.chamberCc,
            pistonCc,
          }}
        />
      </div>
    </div>
  );
}

export function PlanEditor({ jobId }: { jobId: number }) {
  const q = useBuildPlan(jobId);
  if (q.isPending) return <Loading what="the build plan" />;
  if (q.isError) return <LoadFailed what="the build plan" error={q.error} retry={() => q.refetch()} />;
  return (
    <div className="flex flex-col gap-4">
      <div>
        <span className="font-mono text-sm text-muted">{q.data.job.code}</span>
        <h1 className="text-3xl font-semibold">Build plan · {q.data.job.title}</h1>
        <p className="text-muted">
          {q.data.engine.description} · {q.data.engine.cylinders} cylinders · lengths in {q.data.job.unitSystem},
          volumes in cc
        </p>
      </div>
      {q.data.job.locked && <Notice title="Locked">{lockedJobWords(q.data.job, "its build plan")}</Notice>}
      <PlanForm view={q.data} />
    </div>
  );
}
