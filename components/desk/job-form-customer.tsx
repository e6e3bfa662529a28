"use client";

import { useEffect } from "react";
import { useFormContext } from "react-hook-form";
import type { JobInput } from "@/lib/schemas/job";
import { Field, SelectField, asNumber, messageOf } from "./fields";
import { useCustomers } from "./queries";

// Pick a customer of the shop, or enter a new one (created with the job, in one transaction).
export function JobFormCustomer() {
  const {
    register,
    watch,
    setValue,
    formState: { errors },
  } = useFormContext<JobInput>();
  const customers = useCustomers();
  const mode = watch("customer.mode");
  const e = errors.customer as Record<string, { message?: string } | undefined> | undefined;
  const noneYet = customers.isSuccess && customers.data.length === 0;
  // A shop with no customers yet starts on "new", so the first job needs no extra click.
  useEffect(() => {
    if (noneYet && mode === "existing") setValue("customer.mode", "new");
  }, [noneYet, mode, setValue]);
  return (
    <fieldset className="flex flex-col gap-4 rounded-tool border-2 border-rule bg-panel p-4">
      <legend className="px-1 text-lg font-semibold">Customer</legend>
      <div role="radiogroup" aria-label="Customer" className="flex flex-wrap gap-4">
        <label className="flex min-h-11 items-center gap-2 font-medium">
          <input
            type="radio"
            value="existing"
            className="h-5 w-5 accent-steel"
            disabled={noneYet}
            {...register("customer.mode")}
          />{" "}
          A customer we know
        </label>
        <label className="flex min-h-11 items-center gap-2 font-medium">
          <input type="radio" value="new" className="h-5 w-5 accent-steel" {...register("customer.mode")} /> A new
          customer
        </label>
      </div>
      {mode === "existing" ? (
        <SelectField
          label="Customer"
          error={
            messageOf(e?.id ?? e?.root ?? undefined) ??
            (customers.isError ? "Could not load the customers; try again or enter a new one" : undefined)
          }
          hint={customers.isPending ? "Loading customers…" : noneYet ? "No customers yet: enter a new one" : undefined}
          {...register("customer.id", asNumber)}
        >
          <option value="">Pick a customer…</option>
          {(customers.data ?? []).map((c) => (
            <option key={c.id} value={c.id}>
              {c.name}
              {c.email ? ` · ${c.email}` : ""}
            </option>
          ))}
        </SelectField>
      ) : (
        <div className="grid gap-4 md:grid-cols-3">
          <Field label="Name" autoComplete="off" error={messageOf(e?.name)} {...register("customer.name")} />
          <Field
            label="E-mail"
            type="email"
            autoComplete="off"
            hint="The signed build record is sent here"
            error={messageOf(e?.email)}
            {...register("customer.email")}
          />
          <Field
            label="Phone"
            type="tel"
            autoComplete="off"
            error={messageOf(e?.phone)}
            {...register("customer.phone")}
          />
        </div>
      )}
    </fieldset>
  );
}
