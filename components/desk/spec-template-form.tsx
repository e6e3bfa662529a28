"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { FormProvider, useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { api } from "@/lib/client/api";
import { BUILD_KINDS, templateSchema, type TemplateInput, type TemplateValues } from "@/lib/schemas/spec";
import { AreaField, Field, SelectField, ServerError, applyFieldErrors, messageOf } from "./fields";
import { keys, type TemplateRecord } from "./queries";
import { SpecLimitsEditor, blankLimit } from "./spec-limits-editor";

// A spec sheet template: header and limits, one schema for form and route (lib/schemas/spec.ts).
const NEW_TEMPLATE: TemplateInput = {
  name: "",
  engineKind: "",
  buildKind: "street",
  unitSystem: "in",
  notes: "",
  limits: [blankLimit("in")],
};

/** The form's values of a stored sheet (only the schema's fields: the form is checked strictly). */
const valuesOf = (t: TemplateRecord): TemplateInput => ({
  name: t.name,
  engineKind: t.engineKind,
  buildKind: t.buildKind,
  unitSystem: t.unitSystem,
  notes: t.notes ?? "",
  limits: t.limits,
});

export function SpecTemplateForm({ template, jobCount = 0 }: { template?: TemplateRecord; jobCount?: number }) {
  const qc = useQueryClient();
  const router = useRouter();
  const form = useForm<TemplateInput, unknown, TemplateValues>({
    resolver: zodResolver(templateSchema),
    defaultValues: template ? valuesOf(template) : NEW_TEMPLATE,
  });
  const save = useMutation({
    mutationFn: (v: TemplateValues) =>
      api<{ template: TemplateRecord }>(template ? `/api/specs/${template.id}` : "/api/specs", {
        method: template ? "PUT" : "POST",
        json: v,
      }),
    onSuccess: async ({ template: saved }) => {
      qc.setQueryData(keys.spec(saved.id), (old: { jobCount: number } | undefined) => ({
        template: saved,
        jobCount: old?.jobCount ?? 0,
      }));
      await qc.invalidateQueries({ queryKey: keys.specs });
      form.reset(valuesOf(saved));
      if (!template) router.replace(`/desk/specs/${saved.id}`);
    },
    onError: (err) => applyFieldErrors(err, form.setError as never),
  });
  const {
    register,
    watch,
    formState: { errors, isDirty, submitCount, isValid },
  } = form;
  const unit = watch("unitSystem") === "mm" ? "mm" : "in";
  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={form.handleSubmit((v) => save.mutate(v))} className="flex flex-col gap-5">
        {template && jobCount > 0 && (
          <Notice title="Jobs keep their own copy">
            {jobCount} {jobCount === 1 ? "job was" : "jobs were"} started from this sheet. Saving changes new jobs only;
            change a running job&apos;s limits on that job.
          </Notice>
        )}
        <fieldset className="grid gap-4 rounded-tool border-2 border-rule bg-panel p-4 md:grid-cols-4">
          <legend className="px-1 text-lg font-semibold">Sheet</legend>
          <Field
            wrapClass="md:col-span-2"
            label="Name"
            placeholder="e.g. Street V8, cast iron block"
            error={messageOf(errors.name)}
            {...register("name")}
          />
          <Field
            label="Engine type"
            placeholder="e.g. V8 gasoline"
            error={messageOf(errors.engineKind)}
            {...register("engineKind")}
          />
          <Field
            label="Build"
            list="build-kinds"
            hint="street, endurance, marine, diesel… or your own"
            error={messageOf(errors.buildKind)}
            {...register("buildKind")}
          />
          <datalist id="build-kinds">
            {BUILD_KINDS.map((b) => (
              <option key={b} value={b} />
            ))}
          </datalist>
          <SelectField
            label="Written in"
            hint="Each limit keeps its own unit"
            error={messageOf(errors.unitSystem)}
            {...register("unitSystem")}
          >
            <option value="in">Inch</option>
            <option value="mm">Metric</option>
          </SelectField>
          <AreaField
            wrapClass="md:col-span-3"
            label="Notes"
            rows={2}
            error={messageOf(errors.notes)}
            {...register("notes")}
          />
        </fieldset>
        <SpecLimitsEditor lengthUnit={unit} />
        <div className="sticky bottom-0 flex flex-col gap-2 border-t-2 border-rule bg-paper py-3">
          <ServerError error={save.error} />
          {submitCount > 0 && !isValid && (
            <p role="alert" className="font-medium text-fail">
              Some fields need fixing; each one says what to change.
            </p>
          )}
          {save.isSuccess && !isDirty && (
            <p role="status" className="font-medium text-pass">
              Saved: version {save.data.template.version}.
            </p>
          )}
          <div className="flex gap-3">
            <Button type="submit" big disabled={save.isPending}>
              {save.isPending ? "Saving…" : template ? "Save sheet" : "Create sheet"}
            </Button>
            <Button type="button" tone="quiet" big onClick={() => router.push("/desk/specs")}>
              Back to sheets
            </Button>
          </div>
        </div>
      </form>
    </FormProvider>
  );
}
