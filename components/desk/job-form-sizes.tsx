"use client";

import { useEffect, useRef } from "react";
import { useFormContext, useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { JOB_SIZE_WORDS, sizeChangeWords, type JobSize } from "@/lib/domain";
import type { JobInput } from "@/lib/schemas/job";
import { NumberField, asNumber, messageOf } from "./fields";

// The sizes the job machines to. Bore and journal limits that follow the job (and per-inch
// clearances, ISO 286 classes) are worked out from them, so each shows, in words, how far it is
// from the engine's standard size. While the lead has not typed a finished size, it follows the
// engine's standard size as that is entered.

type EngineSizeField = "nominalBore" | "nominalMainJournal" | "nominalRodJournal";
const ROWS: { size: JobSize; engine: EngineSizeField; label: string }[] = [
  { size: "bore", engine: "nominalBore", label: "Finished bore" },
  { size: "mainJournal", engine: "nominalMainJournal", label: "Finished main journal" },
  { size: "rodJournal", engine: "nominalRodJournal", label: "Finished rod journal" },
];

const asSize = (v: unknown) => (typeof v === "number" && Number.isFinite(v) && v > 0 ? v : null);

function against(finished: unknown, standard: unknown, unit: "in" | "mm", size: JobSize): string {
  const words = sizeChangeWords(asSize(finished), asSize(standard), unit);
  if (words) return `${words[0].toUpperCase()}${words.slice(1)} against the engine's ${standard} ${unit}`;
  if (asSize(finished) === null) return `Empty: limits that follow the ${JOB_SIZE_WORDS[size]} cannot judge`;
  return "Enter the engine's standard size to see the over or undersize";
}

export function JobFormSizes({ planBore }: { planBore?: number | null }) {
  const {
    register,
    setValue,
    getValues,
    getFieldState,
    control,
    formState: { errors },
  } = useFormContext<JobInput>();
  const unit = useWatch({ control, name: "unitSystem" }) === "mm" ? "mm" : "in";
  const engine = useWatch({ control, name: "engine" });
  const finished = useWatch({ control, name: "finishedSizes" });
  const e = errors.finishedSizes;

  // A finished size that is empty or equal to the engine's standard size follows that standard size
  // as the lead changes it; one the lead typed, or a stored oversize, stays.
  const last = useRef<Partial<Record<EngineSizeField, number | null>>>({});
  useEffect(() => {
    for (const row of ROWS) {
      const standard = asSize(engine?.[row.engine]);
      const before = last.current[row.engine];
      last.current[row.engine] = standard;
      if (before === undefined || before === standard || standard === null) continue;
      const name = `finishedSizes.${row.size}` as const;
      const current = asSize(getValues(name));
      if (getFieldState(name).isDirty || (current !== null && current !== before)) continue;
      setValue(name, standard, { shouldValidate: true });
    }
  }, [engine, getFieldState, getValues, setValue]);

  const plan = asSize(planBore);
  return (
    <fieldset className="grid gap-4 rounded-tool border-2 border-rule bg-panel p-4 md:grid-cols-3">
      <legend className="px-1 text-lg font-semibold">Finished sizes</legend>
      <p className="text-sm text-muted md:col-span-3">
        The sizes this job machines to. Limits that follow the job judge bores and journals against them; changing one
        judges the job&apos;s readings again.
      </p>
      {ROWS.map((row) => (
        <NumberField
          key={row.size}
          label={row.label}
          suffix={unit}
          hint={against(finished?.[row.size], engine?.[row.engine], unit, row.size)}
          error={messageOf(e?.[row.size])}
          {...register(`finishedSizes.${row.size}`, asNumber)}
        />
      ))}
      {plan !== null && asSize(finished?.bore) !== plan && (
        <div className="md:col-span-3">
          <Button
            type="button"
            tone="quiet"
            onClick={() => setValue("finishedSizes.bore", plan, { shouldDirty: true, shouldValidate: true })}
          >
            Use the build plan&apos;s bore ({plan} {unit})
          </Button>
        </div>
      )}
    </fieldset>
  );
}
