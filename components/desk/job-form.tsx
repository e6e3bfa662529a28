"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { FormProvider, useForm, type DefaultValues } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { api } from "@/lib/client/api";
import { LENGTH_UNITS, UNIT_SYSTEM_WORDS } from "@/lib/domain";
import { DESK_STATUSES, jobEditSchema, jobSchema, type JobInput, type JobValues } from "@/lib/schemas/job";
import { ChangeConfirm } from "./change-confirm";
import { useEditPreview } from "./job-edit-preview";
import { STATUS_WORDS } from "@/components/job-status";
import { AreaField, Field, SelectField, ServerError, applyFieldErrors, asNumber, messageOf } from "./fields";
import { JobFormCustomer } from "./job-form-customer";
import { JobFormEngine } from "./job-form-engine";
import { JobFormSizes } from "./job-form-sizes";
import { keys, useTemplates, type JobDetail } from "./queries";

// Create or edit a job with the one shared schema (lib/schemas/job.ts). Creating picks the
// spec sheet whose limits the job copies; editing leaves the job's own limits alone.
// Customer, spec sheet, bore and stroke start empty: the lead must choose or enter them; the
// finished sizes follow the engine's until the lead states the job's own.
export const NEW_JOB: DefaultValues<JobInput> = {
  code: "",
  title: "",
  customer: { mode: "existing" },
  unitSystem: "in",
  dueDate: "",
  status: "intake",
  notes: "",
  engine: {
    description: "",
    cylinders: 8,
    layout: "v",
    mains: 5,
    valvesPerCylinder: 2,
    ringsPerPiston: 3,
    boltsPerRod: 2,
    blockMaterial: "greyCastIron",
    headMaterial: null,
    pistonMaterial: null,
    blockSerial: "",
    crankSerial: "",
    headSerials: "",
    fuel: null,
    nominalMainJournal: null,
    nominalRodJournal: null,
  },
  finishedSizes: { bore: null, mainJournal: null, rodJournal: null },
};

/** The edit form's values from a job's detail (also used for quick status moves). */
export function editValuesOf(d: JobDetail): Omit<JobInput, "templateId"> {
  const { blockMaterial, ...engine } = d.engine;
  return {
    code: d.job.code,
    title: d.job.title,
    customer: { mode: "existing", id: d.customer.id },
    unitSystem: d.job.unitSystem,
    dueDate: d.job.dueDate ?? "",
    status: d.job.status as JobValues["status"],
    notes: d.job.notes ?? "",
    engine: {
      ...engine,
      blockMaterial: blockMaterial as JobValues["engine"]["blockMaterial"],
      headMaterial: engine.headMaterial as JobValues["engine"]["headMaterial"],
      pistonMaterial: engine.pistonMaterial as JobValues["engine"]["pistonMaterial"],
      blockSerial: engine.blockSerial ?? "",
      crankSerial: engine.crankSerial ?? "",
      headSerials: engine.headSerials ?? "",
    },
    // A size the job has not stated yet starts from the build plan's bore, else the engine's size.
    finishedSizes: {
      bore: d.job.finishedSizes.bore ?? d.job.planBore ?? d.engine.nominalBore,
      mainJournal: d.job.finishedSizes.mainJournal ?? d.engine.nominalMainJournal,
      rodJournal: d.job.finishedSizes.rodJournal ?? d.engine.nominalRodJournal,
    },
  };
}

function useActiveTemplates() {
  const templates = useTemplates();
  return { templates, active: (templates.data ?? []).filter((t) => !t.archived) };
}

export function JobForm({ job }: { job?: JobDetail }) {
  const editing = !!job;
  const qc = useQueryClient();
  const router = useRouter();
  const form = useForm<JobInput, unknown, JobValues>({
    resolver: zodResolver((editing ? jobEditSchema : jobSchema) as typeof jobSchema),
    defaultValues: job ? (editValuesOf(job) as DefaultValues<JobInput>) : NEW_JOB,
    mode: "onTouched",
  });
  const { templates, active } = useActiveTemplates();
  const unitsFixed = editing && job.summary.readingCount > 0;
  const save = useMutation({
    mutationFn: (v: JobValues): Promise<JobDetail | { id: number }> =>
      editing
        ? api<JobDetail>(`/api/jobs/${job.job.id}`, { method: "PATCH", json: v })
        : api<{ id: number }>("/api/jobs", { method: "POST", json: v }),
    onSuccess: async (res) => {
      if (editing) qc.setQueryData(keys.job(job.job.id), res);
      await Promise.all([
        qc.invalidateQueries({ queryKey: keys.jobs }),
        qc.invalidateQueries({ queryKey: keys.customers }),
      ]);
      router.push(`/desk/jobs/${editing ? job.job.id : (res as { id: number }).id}`);
    },
    onError: (err) => applyFieldErrors(err, form.setError as never),
  });
  const { confirming, setConfirming, preview } = useEditPreview(job, save.mutate, form.setError as never);
  const submit = (v: JobValues) => {
    save.reset();
    if (editing) preview.mutate(v);
    else save.mutate(v);
  };
  const {
    register,
    formState: { errors },
  } = form;
  const onTemplate = (id: number) => {
    const t = active.find((x) => x.id === id);
    if (t && !form.getFieldState("unitSystem").isDirty) form.setValue("unitSystem", t.unitSystem);
  };

  return (
    <FormProvider {...form}>
      <form
        noValidate
        onSubmit={form.handleSubmit(submit)}
        onChange={() => setConfirming(null)}
        className="flex flex-col gap-5"
      >
        <ServerError error={save.error ?? preview.error} />
        <fieldset className="grid gap-4 rounded-tool border-2 border-rule bg-panel p-4 md:grid-cols-4">
          <legend className="px-1 text-lg font-semibold">Job</legend>
          <Field label="Job code" placeholder="e.g. KF-2614" error={messageOf(errors.code)} {...register("code")} />
          <Field
            wrapClass="md:col-span-3"
            label="Title"
            placeholder="e.g. Pickup V8 rebuild"
            error={messageOf(errors.title)}
            {...register("title")}
          />
          {!editing && (
            <SelectField
              wrapClass="md:col-span-2"
              label="Spec sheet"
              error={
                messageOf(errors.templateId) ??
                (templates.isError ? "Could not load the spec sheets; try again" : undefined)
              }
              hint={
                templates.isPending
                  ? "Loading spec sheets…"
                  : "The job copies this sheet's limits; later edits of the sheet do not change the job"
              }
              {...register("templateId", { ...asNumber, onChange: (e) => onTemplate(Number(e.target.value)) })}
            >
              <option value="">Pick a spec sheet…</option>
              {active.map((t) => (
                <option key={t.id} value={t.id}>
                  {t.name} · {t.buildKind} · {t.unitSystem}
                </option>
              ))}
            </SelectField>
          )}
          {editing && (
            <p className="md:col-span-2 text-sm text-muted">
              Limits copied from{" "}
              <span className="font-semibold text-ink">{job.job.templateName ?? "a sheet since deleted"}</span>; edit
              them on the job&apos;s limits page.
            </p>
          )}
          {unitsFixed ? (
            <div className="flex flex-col gap-1 text-sm">
              <span className="font-medium">Units</span>
              <span className="min-h-11 content-center">{UNIT_SYSTEM_WORDS[job.job.unitSystem]}</span>
              <span className="text-muted">Fixed: readings were taken in these units</span>
              <input type="hidden" {...register("unitSystem")} />
            </div>
          ) : (
            <SelectField label="Units" error={messageOf(errors.unitSystem)} {...register("unitSystem")}>
              {LENGTH_UNITS.map((u) => (
                <option key={u} value={u}>
                  {UNIT_SYSTEM_WORDS[u]}
                </option>
              ))}
            </SelectField>
          )}
          <SelectField label="Status" error={messageOf(errors.status)} {...register("status")}>
            {DESK_STATUSES.map((s) => (
              <option key={s} value={s}>
                {STATUS_WORDS[s]}
              </option>
            ))}
          </SelectField>
          <Field label="Due date" type="date" error={messageOf(errors.dueDate)} {...register("dueDate")} />
          <AreaField
            wrapClass="md:col-span-3"
            label="Notes (for the shop; never on the customer's record)"
            rows={2}
            error={messageOf(errors.notes)}
            {...register("notes")}
          />
        </fieldset>
        <JobFormCustomer />
        <JobFormEngine />
        <JobFormSizes planBore={job?.job.planBore} />
        {confirming && (
          <ChangeConfirm
            what="Saving this job"
            preview={confirming.preview}
            saving={save.isPending}
            onConfirm={(n) => save.mutate({ ...confirming.values, confirmedFlagsOpened: n } as JobValues)}
            onCancel={() => setConfirming(null)}
          />
        )}
        <div className="flex gap-3">
          <Button type="submit" big disabled={save.isPending || preview.isPending || !!confirming}>
            {save.isPending ? "Saving…" : editing ? "Save changes" : "Create job"}
          </Button>
          <Button type="button" tone="quiet" big onClick={() => router.back()}>
            Cancel
          </Button>
        </div>
      </form>
    </FormProvider>
  );
}
