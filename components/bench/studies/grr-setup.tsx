"use client";

import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { unitWords } from "@/lib/domain";
import { GRR_DESIGN } from "@/lib/domain/gauge-studies";
import { parseDesign, type DesignFields, type DesignProblems } from "@/lib/offline/study-design";
import type { DraftGauge, GrrDesign } from "@/lib/offline/study-draft-shape";

// Who measures, how many parts and trials, and the tolerance the study is judged against. The
// people of the shop who used this tablet are offered by name; anyone else can be typed.
interface Props {
  gauge: DraftGauge;
  me: string;
  people: string[];
  onDone: (design: GrrDesign) => Promise<void>;
}

const PRESSED = "aria-pressed:border-steel aria-pressed:bg-steel aria-pressed:text-steel-ink";
const range = (r: { min: number; max: number }) => Array.from({ length: r.max - r.min + 1 }, (_, i) => r.min + i);

function Choice({
  label,
  values,
  value,
  onPick,
}: {
  label: string;
  values: number[];
  value: number;
  onPick: (n: number) => void;
}) {
  return (
    <div role="group" aria-label={label} className="flex flex-col gap-1.5">
      <span className="font-medium">{label}</span>
      <div className="flex flex-wrap gap-2">
        {values.map((n) => (
          <button
            key={n}
            type="button"
            aria-pressed={n === value}
            onClick={() => onPick(n)}
            className={`min-h-12 min-w-12 rounded-tool border-2 border-rule bg-panel text-lg font-semibold ${PRESSED}`}
          >
            {n}
          </button>
        ))}
      </div>
    </div>
  );
}

export function GrrSetup({ gauge, me, people, onDone }: Props) {
  const [fields, setFields] = useState<DesignFields>({ appraisers: [me, "", ""], parts: 10, trials: 3, tolerance: "" });
  const [errors, setErrors] = useState<DesignProblems>({});
  const patch = (p: Partial<DesignFields>) => {
    setFields({ ...fields, ...p });
    setErrors({});
  };
  const setName = (i: number, name: string) =>
    patch({ appraisers: fields.appraisers.map((n, j) => (j === i ? name : n)) });
  const offer = people.filter((p) => !fields.appraisers.some((n) => n.trim().toLowerCase() === p.toLowerCase()));
  const fill = (name: string) => {
    const at = fields.appraisers.findIndex((n) => !n.trim());
    if (at >= 0) setName(at, name);
  };
  async function submit(e: FormEvent) {
    e.preventDefault();
    const out = parseDesign(fields);
    if ("errors" in out) setErrors(out.errors);
    else await onDone(out.design);
  }
  return (
    <form onSubmit={(e) => void submit(e)} className="flex flex-col gap-4" noValidate aria-label="Study design">
      <fieldset className="flex flex-col gap-2">
        <legend className="font-medium">People who measure (2 or 3)</legend>
        <div className="grid gap-3 sm:grid-cols-3">
          {fields.appraisers.map((n, i) => (
            <TextField
              key={i}
              label={`Person ${i + 1}${i === 2 ? " (if three)" : ""}`}
              value={n}
              onChange={(e) => setName(i, e.target.value)}
            />
          ))}
        </div>
        {offer.length > 0 && (
          <div className="flex flex-wrap gap-2" aria-label="People who used this tablet">
            {offer.map((p) => (
              <Button key={p} tone="quiet" onClick={() => fill(p)}>
                + {p}
              </Button>
            ))}
          </div>
        )}
        {errors.appraisers && (
          <p className="font-medium text-fail" role="alert">
            {errors.appraisers}
          </p>
        )}
      </fieldset>
      <Choice
        label="Parts"
        values={range(GRR_DESIGN.parts)}
        value={fields.parts}
        onPick={(parts) => patch({ parts })}
      />
      {errors.parts && <p className="font-medium text-fail">{errors.parts}</p>}
      <Choice
        label="Trials"
        values={range(GRR_DESIGN.trials)}
        value={fields.trials}
        onPick={(trials) => patch({ trials })}
      />
      {errors.trials && <p className="font-medium text-fail">{errors.trials}</p>}
      <TextField
        label={`Tolerance T of the characteristic (${unitWords(gauge.unit)}), if known`}
        inputMode="decimal"
        value={fields.tolerance}
        onChange={(e) => patch({ tolerance: e.target.value })}
        error={errors.tolerance}
        hint="Upper limit − lower limit; without it the study is judged against its own variation only"
      />
      <p className="text-sm text-muted">
        Number the parts 1 to {fields.parts} where everyone can see them. Each person measures every part once per
        trial, without seeing the others&apos; figures.
      </p>
      <Button big type="submit" className="self-start">
        Start measuring
      </Button>
    </form>
  );
}
