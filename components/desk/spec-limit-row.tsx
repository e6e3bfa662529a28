"use client";

import { useFormContext, useWatch } from "react-hook-form";
import { Field, NumberField, SelectField, CheckField, asNumber, messageOf } from "./fields";
import {
  CHARACTERISTICS,
  GAUGE_KIND_WORDS,
  LENGTH_UNITS,
  LIMIT_TYPES,
  TORQUE_UNITS,
  GAUGE_KINDS,
  JOB_SIZE_OF,
  SECTION_LABELS,
  unitWords,
  usualGaugeKind,
  type CharacteristicId,
  type LengthUnit,
  type LimitType,
  type SectionId,
} from "@/lib/domain";
import { STATION_FORMS } from "@/lib/schemas/spec-pattern";
import { LIMIT_FIELDS, LIMIT_TYPE_WORDS, type LimitInput } from "@/lib/schemas/spec";
import { SpecLimitPreview } from "./spec-limit-preview";
import { CommonPracticeMark } from "./common-practice-mark";

// One limit of a spec sheet (a template's or a job's own), edited in place. The value fields
// shown follow the limit type; a value typed for another type stays in the form until saved.
type Values = { limits: LimitInput[]; unitSystem?: LengthUnit };

const FIELD_WORDS: Record<string, string> = {
  min: "Minimum",
  max: "Maximum",
  nominal: "Nominal size",
  tolPlus: "Plus tolerance",
  tolMinus: "Minus tolerance",
  perInchMin: "Minimum",
  perInchMax: "Maximum",
  isoClass: "ISO 286 class",
};
const BY_SECTION = Object.values(CHARACTERISTICS).reduce<Record<string, CharacteristicId[]>>(
  (acc, c) => ((acc[c.section] ??= []).push(c.id), acc),
  {},
);
const empty = { setValueAs: (v: unknown) => (v === "" ? null : v) };

function CharacteristicOptions() {
  return (
    <>
      {(Object.keys(BY_SECTION) as SectionId[]).map((s) => (
        <optgroup key={s} label={SECTION_LABELS[s]}>
          {BY_SECTION[s].map((id) => (
            <option key={id} value={id}>
              {CHARACTERISTICS[id].label}
              {CHARACTERISTICS[id].derived ? " (computed)" : ""}
            </option>
          ))}
        </optgroup>
      ))}
    </>
  );
}

export function SpecLimitRow({
  index,
  count,
  onMove,
  onRemove,
  defaultLengthUnit,
}: {
  index: number;
  count: number;
  onMove: (from: number, to: number) => void;
  onRemove: (i: number) => void;
  defaultLengthUnit: LengthUnit;
}) {
  const {
    register,
    setValue,
    getValues,
    formState: { errors },
  } = useFormContext<Values>();
  const limit = useWatch<Values, `limits.${number}`>({ name: `limits.${index}` }) as LimitInput | undefined;
  const e = (errors.limits?.[index] ?? {}) as Record<string, { message?: string } | undefined>;
  const info = limit?.characteristic ? CHARACTERISTICS[limit.characteristic] : undefined;
  const torque = info?.kind === "torque";
  const p = `limits.${index}` as const;
  // Torque takes plain figures only; a job states its own size only for bores and journals.
  const suits = (t: LimitType) =>
    t === "job_size_tol"
      ? !!limit?.characteristic && !!JOB_SIZE_OF[limit.characteristic]
      : !torque || (t !== "per_inch" && t !== "iso286");

  // A new characteristic brings its usual gauge and a unit of the right kind.
  const onCharacteristic = (id: CharacteristicId) => {
    const c = CHARACTERISTICS[id];
    if (!c) return;
    const unit = getValues(`${p}.unit`);
    const lengthUnit = unit === "in" || unit === "mm";
    if (c.kind === "torque" && lengthUnit) setValue(`${p}.unit`, defaultLengthUnit === "mm" ? "nm" : "lbf_ft");
    if (c.kind === "length" && !lengthUnit) setValue(`${p}.unit`, defaultLengthUnit);
    setValue(`${p}.gaugeKind`, usualGaugeKind(id) ?? null);
  };

  return (
    <li
      className="flex flex-col gap-3 rounded-tool border-2 border-rule bg-panel p-4"
      aria-label={`Limit ${index + 1}${info ? `: ${info.label}` : ""}`}
    >
      <div className="grid gap-3 md:grid-cols-12">
        <SelectField
          wrapClass="md:col-span-4"
          label={`Limit ${index + 1} · characteristic`}
          error={messageOf(e.characteristic)}
          {...register(`${p}.characteristic`, { onChange: (ev) => onCharacteristic(ev.target.value) })}
        >
          <option value="">Pick one…</option>
          <CharacteristicOptions />
        </SelectField>
        <Field
          wrapClass="md:col-span-4"
          label="Stations"
          className="font-mono"
          spellCheck={false}
          autoComplete="off"
          error={messageOf(e.stationPattern)}
          hint={
            info ? (
              <>
                Written <span className="font-mono">{STATION_FORMS[info.id]}</span>; * for any part
              </>
            ) : (
              "Pick the characteristic to see how its stations are written"
            )
          }
          {...register(`${p}.stationPattern`)}
        />
        <SelectField
          wrapClass="md:col-span-3"
          label="Limit type"
          error={messageOf(e.limitType)}
          {...register(`${p}.limitType`)}
        >
          {LIMIT_TYPES.map((t) => (
            <option key={t} value={t} disabled={!suits(t)}>
              {LIMIT_TYPE_WORDS[t]}
            </option>
          ))}
        </SelectField>
        <SelectField wrapClass="md:col-span-1" label="Unit" error={messageOf(e.unit)} {...register(`${p}.unit`)}>
          {(torque ? TORQUE_UNITS : LENGTH_UNITS).map((u) => (
            <option key={u} value={u}>
              {unitWords(u)}
            </option>
          ))}
        </SelectField>
        {(limit?.limitType ? LIMIT_FIELDS[limit.limitType] : []).map((f) =>
          f === "isoClass" ? (
            <Field
              key={f}
              wrapClass="md:col-span-2"
              label={FIELD_WORDS[f]}
              placeholder="H7, g6, js6…"
              className="font-mono"
              error={messageOf(e[f])}
              {...register(`${p}.isoClass`)}
            />
          ) : (
            <NumberField
              key={f}
              wrapClass="md:col-span-2"
              label={limit?.limitType === "iso286" ? "Basic size (optional)" : FIELD_WORDS[f]}
              suffix={f.startsWith("perInch") ? "/ in dia." : unitWords(limit?.unit ?? "")}
              hint={limit?.limitType === "iso286" ? "Empty: the job's finished size" : undefined}
              error={messageOf(e[f])}
              {...register(`${p}.${f}`, asNumber)}
            />
          ),
        )}
        <SelectField
          wrapClass="md:col-span-2"
          label="Gauge expected"
          error={messageOf(e.gaugeKind)}
          {...register(`${p}.gaugeKind`, empty)}
        >
          <option value="">Any / computed</option>
          {GAUGE_KINDS.map((g) => (
            <option key={g} value={g}>
              {GAUGE_KIND_WORDS[g]}
            </option>
          ))}
        </SelectField>
        <Field
          wrapClass="md:col-span-2"
          label="Label (optional)"
          error={messageOf(e.label)}
          {...register(`${p}.label`)}
        />
        <div className="flex items-end md:col-span-2">
          <CheckField label="Required for release" {...register(`${p}.required`)} />
        </div>
      </div>
      {limit?.commonPractice && (
        <CommonPracticeMark onConfirm={() => setValue(`${p}.commonPractice`, false, { shouldDirty: true })} />
      )}
      <div className="flex flex-wrap items-center justify-between gap-2">
        {limit ? <SpecLimitPreview limit={limit} /> : <span />}
        <span className="flex gap-1">
          <button
            type="button"
            className="min-h-11 rounded-tool border-2 border-rule px-3 text-sm disabled:opacity-40"
            disabled={index === 0}
            onClick={() => onMove(index, index - 1)}
            aria-label={`Move limit ${index + 1} up`}
          >
            Up
          </button>
          <button
            type="button"
            className="min-h-11 rounded-tool border-2 border-rule px-3 text-sm disabled:opacity-40"
            disabled={index === count - 1}
            onClick={() => onMove(index, index + 1)}
            aria-label={`Move limit ${index + 1} down`}
          >
            Down
          </button>
          <button
            type="button"
            className="min-h-11 rounded-tool border-2 border-fail px-3 text-sm font-semibold text-fail"
            onClick={() => onRemove(index)}
            aria-label={`Remove limit ${index + 1}`}
          >
            Remove
          </button>
        </span>
      </div>
    </li>
  );
}
