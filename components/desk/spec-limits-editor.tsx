"use client";

import { useFieldArray, useFormContext } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import type { LengthUnit } from "@/lib/domain";
import { PATTERN_RULE } from "@/lib/schemas/spec-pattern";
import type { LimitInput } from "@/lib/schemas/spec";
import { SpecLimitRow } from "./spec-limit-row";

// The list of limits of a sheet (useFieldArray): add, reorder, remove. Order matters only as
// the last tie-break between two equally specific patterns, so it is kept as entered.
type Values = { limits: LimitInput[] };

export const blankLimit = (unit: LengthUnit): LimitInput => ({
  characteristic: "" as LimitInput["characteristic"],
  stationPattern: "*",
  limitType: "min_max",
  unit,
  min: null,
  max: null,
  nominal: null,
  tolPlus: null,
  tolMinus: null,
  perInchMin: null,
  perInchMax: null,
  isoClass: null,
  required: true,
  gaugeKind: null,
  label: null,
});

export function SpecLimitsEditor({ lengthUnit }: { lengthUnit: LengthUnit }) {
  const {
    control,
    formState: { errors },
  } = useFormContext<Values>();
  const { fields, append, move, remove } = useFieldArray({ control, name: "limits" });
  const listError = errors.limits?.root?.message ?? errors.limits?.message;
  return (
    <section className="flex flex-col gap-3" aria-labelledby="limits-heading">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id="limits-heading" className="text-xl font-semibold">
          Limits ({fields.length})
        </h2>
        <Button type="button" tone="quiet" onClick={() => append(blankLimit(lengthUnit))}>
          Add a limit
        </Button>
      </div>
      <Notice title="Which stations a limit applies to">{PATTERN_RULE}</Notice>
      {listError && <Notice tone="error">{String(listError)}</Notice>}
      {fields.length === 0 && (
        <p className="rounded-tool border-2 border-dashed border-rule p-6 text-muted">
          No limits yet. Add the first one.
        </p>
      )}
      <ol className="flex flex-col gap-3">
        {fields.map((f, i) => (
          <SpecLimitRow
            key={f.id}
            index={i}
            count={fields.length}
            onMove={move}
            onRemove={remove}
            defaultLengthUnit={lengthUnit}
          />
        ))}
      </ol>
      {fields.length > 3 && (
        <div>
          <Button type="button" tone="quiet" onClick={() => append(blankLimit(lengthUnit))}>
            Add a limit
          </Button>
        </div>
      )}
    </section>
  );
}
