"use client";

import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { unitWords } from "@/lib/domain";
import type { StudyReference } from "@/lib/domain/gauge-studies/types";
import { parseReference, type ReferenceFields, type ReferenceProblems } from "@/lib/offline/study-entry";
import type { DraftGauge } from "@/lib/offline/study-draft-shape";
import type { SettingMaster } from "@/lib/schemas/bench-gauges";

// The reference a repeatability run reads: a setting master or gauge block, its size and expanded U
// as its certificate states them (in the gauge's unit). What was typed stays after a refusal.
interface Props {
  gauge: DraftGauge;
  /** The gauge's setting master on file, when the admin registered one. */
  master?: SettingMaster | null;
  onDone: (reference: StudyReference) => Promise<void>;
}

export function ReferenceForm({ gauge, master, onDone }: Props) {
  const [fields, setFields] = useState<ReferenceFields>({
    value: master ? String(master.size) : "",
    expandedU: master ? String(master.u) : "",
    coverageK: "2",
  });
  const [errors, setErrors] = useState<ReferenceProblems>({});
  const unit = unitWords(gauge.unit);
  const set = (k: keyof ReferenceFields) => (e: { target: { value: string } }) => {
    setFields({ ...fields, [k]: e.target.value });
    setErrors({ ...errors, [k]: undefined });
  };
  async function submit(e: FormEvent) {
    e.preventDefault();
    const out = parseReference(fields, gauge);
    if ("errors" in out) setErrors(out.errors);
    else await onDone(out.reference);
  }
  return (
    <form onSubmit={(e) => void submit(e)} className="flex flex-col gap-4" noValidate aria-label="Reference">
      <p>
        {master?.label
          ? `The setting master on file for this gauge is ${master.label}; check its figures against its certificate.`
          : "Type the reference's size and expanded uncertainty U from its certificate " +
            "(a setting master or gauge block)."}
      </p>
      <div className="grid gap-3 sm:grid-cols-3">
        <TextField
          label={`Reference size (${unit})`}
          inputMode="decimal"
          value={fields.value}
          onChange={set("value")}
          error={errors.value}
        />
        <TextField
          label={`Certificate's U (${unit})`}
          inputMode="decimal"
          value={fields.expandedU}
          onChange={set("expandedU")}
          error={errors.expandedU}
        />
        <TextField
          label="Coverage factor k"
          inputMode="decimal"
          value={fields.coverageK}
          onChange={set("coverageK")}
          error={errors.coverageK}
          hint="As the certificate states it, usually 2"
        />
      </div>
      <Button big type="submit" className="self-start">
        Use this reference
      </Button>
    </form>
  );
}
