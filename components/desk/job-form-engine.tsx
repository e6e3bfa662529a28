"use client";

import { useFormContext } from "react-hook-form";
import { EXPANSION_COEFFICIENTS } from "@/lib/domain";
import { MATERIALS, type JobInput } from "@/lib/schemas/job";
import { Field, NumberField, SelectField, asNumber, messageOf } from "./fields";

// The engine as it came in: shape (what the bench route is built from), standard (nominal) sizes,
// materials (for the 20 °C correction) and serials.
function MaterialOptions({ optional }: { optional?: boolean }) {
  return (
    <>
      {optional && <option value="">Not recorded</option>}
      {MATERIALS.map((m) => (
        <option key={m} value={m}>
          {EXPANSION_COEFFICIENTS[m].label}
        </option>
      ))}
    </>
  );
}

export function JobFormEngine() {
  const {
    register,
    watch,
    formState: { errors },
  } = useFormContext<JobInput>();
  const e = errors.engine;
  const unit = watch("unitSystem") === "mm" ? "mm" : "in";
  const empty = (v: unknown) => (v === "" ? null : v);
  return (
    <fieldset className="grid gap-4 rounded-tool border-2 border-rule bg-panel p-4 md:grid-cols-4">
      <legend className="px-1 text-lg font-semibold">Engine</legend>
      <Field
        wrapClass="md:col-span-4"
        label="Description"
        placeholder="e.g. small-block V8, 0.030 in over"
        error={messageOf(e?.description)}
        {...register("engine.description")}
      />
      <SelectField label="Layout" error={messageOf(e?.layout)} {...register("engine.layout")}>
        <option value="inline">Inline</option>
        <option value="v">V</option>
        <option value="flat">Flat (opposed)</option>
      </SelectField>
      <NumberField label="Cylinders" error={messageOf(e?.cylinders)} {...register("engine.cylinders", asNumber)} />
      <NumberField label="Main bearings" error={messageOf(e?.mains)} {...register("engine.mains", asNumber)} />
      <NumberField
        label="Valves per cylinder"
        error={messageOf(e?.valvesPerCylinder)}
        {...register("engine.valvesPerCylinder", asNumber)}
      />
      <NumberField
        label="Rings per piston"
        error={messageOf(e?.ringsPerPiston)}
        {...register("engine.ringsPerPiston", asNumber)}
      />
      <NumberField
        label="Bolts per rod"
        error={messageOf(e?.boltsPerRod)}
        {...register("engine.boltsPerRod", asNumber)}
      />
      <NumberField
        label="Nominal bore"
        suffix={unit}
        error={messageOf(e?.nominalBore)}
        {...register("engine.nominalBore", asNumber)}
      />
      <NumberField
        label="Nominal stroke"
        suffix={unit}
        error={messageOf(e?.nominalStroke)}
        {...register("engine.nominalStroke", asNumber)}
      />
      <NumberField
        label="Standard main journal"
        suffix={unit}
        hint="Optional; the crank's size before any grinding"
        error={messageOf(e?.nominalMainJournal)}
        {...register("engine.nominalMainJournal", asNumber)}
      />
      <NumberField
        label="Standard rod journal"
        suffix={unit}
        hint="Optional"
        error={messageOf(e?.nominalRodJournal)}
        {...register("engine.nominalRodJournal", asNumber)}
      />
      <SelectField label="Block material" error={messageOf(e?.blockMaterial)} {...register("engine.blockMaterial")}>
        <MaterialOptions />
      </SelectField>
      <SelectField
        label="Head material"
        error={messageOf(e?.headMaterial)}
        {...register("engine.headMaterial", { setValueAs: empty })}
      >
        <MaterialOptions optional />
      </SelectField>
      <SelectField
        label="Piston material"
        error={messageOf(e?.pistonMaterial)}
        {...register("engine.pistonMaterial", { setValueAs: empty })}
      >
        <MaterialOptions optional />
      </SelectField>
      <SelectField label="Fuel" error={messageOf(e?.fuel)} {...register("engine.fuel", { setValueAs: empty })}>
        <option value="">Not recorded</option>
        <option value="gasoline">Gasoline</option>
        <option value="diesel">Diesel</option>
        <option value="other">Other</option>
      </SelectField>
      <Field label="Block serial" error={messageOf(e?.blockSerial)} {...register("engine.blockSerial")} />
      <Field label="Crank serial" error={messageOf(e?.crankSerial)} {...register("engine.crankSerial")} />
      <Field
        wrapClass="md:col-span-2"
        label="Head serials"
        hint="Both heads of a V, e.g. HD-7712 / HD-7713"
        error={messageOf(e?.headSerials)}
        {...register("engine.headSerials")}
      />
    </fieldset>
  );
}
