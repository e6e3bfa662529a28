"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { TextField } from "@/components/ui/text-field";
import { api, ApiError } from "@/lib/client/api";
import { UNIT_SYSTEM_WORDS } from "@/lib/domain";
import { UNIT_SYSTEMS } from "@/lib/schemas/enums";
import { PASSWORD_MIN_LENGTH } from "@/lib/schemas/password";
import { shopSignUpSchema, type ShopSignUpInput, type ShopSignUpValues } from "@/lib/schemas/shop";
import { ResendLink } from "./resend-link";

// The public "start a shop" form. A refusal keeps everything typed and puts the server's words
// on the field they are about (a name or e-mail already in use, a password too easy to guess).
export function StartShopForm() {
  const [serverError, setServerError] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const form = useForm<ShopSignUpValues, unknown, ShopSignUpInput>({
    resolver: zodResolver(shopSignUpSchema),
    defaultValues: { shopName: "", unitSystem: "in", adminName: "", email: "", password: "" },
  });
  const e = form.formState.errors;

  const onSubmit = form.handleSubmit(async (values) => {
    setServerError(null);
    try {
      const res = await api<{ email: string }>("/api/shops", { method: "POST", json: values });
      setSentTo(res.email);
    } catch (err) {
      if (err instanceof ApiError && err.fields) {
        for (const [field, messages] of Object.entries(err.fields))
          if (field in values) form.setError(field as keyof ShopSignUpValues, { message: messages[0] });
      }
      setServerError(err instanceof ApiError ? err.message : "Could not reach the server. Try again in a moment.");
    }
  });

  if (sentTo) {
    return (
      <section className="flex flex-col gap-4 rounded-tool border-2 border-rule bg-panel p-6" data-testid="check-mail">
        <h1 className="text-2xl font-semibold">Check your e-mail</h1>
        <p>
          We sent a link to <strong>{sentTo}</strong>. Open it to confirm the address; the shop opens then, with you as
          its admin. Until then nobody can sign in to it.
        </p>
        <ResendLink email={sentTo} />
      </section>
    );
  }
  return (
    <form
      method="post"
      onSubmit={onSubmit}
      noValidate
      className="flex flex-col gap-5 rounded-tool border-2 border-rule bg-panel p-6"
    >
      <h1 className="text-2xl font-semibold">Start a shop</h1>
      {serverError && <Notice tone="error">{serverError}</Notice>}
      <TextField
        label="Shop name"
        autoComplete="organization"
        error={e.shopName?.message}
        {...form.register("shopName")}
      />
      <fieldset className="flex flex-col gap-2">
        <legend className="font-medium">Units the shop works in</legend>
        {UNIT_SYSTEMS.map((u) => (
          <label key={u} className="flex min-h-11 items-center gap-3">
            <input type="radio" value={u} className="h-5 w-5 accent-steel" {...form.register("unitSystem")} />
            {UNIT_SYSTEM_WORDS[u]}
          </label>
        ))}
        {e.unitSystem && <span className="text-sm font-medium text-fail">{e.unitSystem.message}</span>}
      </fieldset>
      <TextField label="Your name" autoComplete="name" error={e.adminName?.message} {...form.register("adminName")} />
      <TextField
        label="Your e-mail"
        type="email"
        autoComplete="email"
        hint="You will be the shop's admin; the confirmation link goes here"
        error={e.email?.message}
        {...form.register("email")}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters; a few unrelated words are easy to remember and hard to guess`}
        error={e.password?.message}
        {...form.register("password")}
      />
      <Button type="submit" big disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? "Starting…" : "Start the shop"}
      </Button>
    </form>
  );
}
