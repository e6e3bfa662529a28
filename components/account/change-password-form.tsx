"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { api, ApiError } from "@/lib/client/api";
import { changePasswordSchema, type ChangePasswordInput } from "@/lib/schemas/password";
import { PasswordField } from "./password-field";

const FIELDS = ["currentPassword", "newPassword"] as const;

// Changing one's own password; `then` is where to go once done (the person's home when the change
// was owed, since every other screen waited for it).
export function ChangePasswordForm({ email, then }: { email: string; then?: string }) {
  const [serverError, setServerError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const form = useForm<ChangePasswordInput>({
    resolver: zodResolver(changePasswordSchema),
    defaultValues: { currentPassword: "", newPassword: "" },
  });
  const onSubmit = form.handleSubmit(async (values) => {
    setServerError(null);
    setDone(null);
    try {
      const r = await api<{ sessionsEnded: number }>("/api/me/password", { method: "POST", json: values });
      if (then) return window.location.assign(then);
      form.reset();
      const others = r.sessionsEnded === 1 ? "1 other device was" : `${r.sessionsEnded} other devices were`;
      setDone(`Password changed. ${r.sessionsEnded ? `${others} signed out.` : "You stay signed in here."}`);
    } catch (err) {
      const fields = err instanceof ApiError ? err.fields : undefined;
      const named = FIELDS.filter((f) => fields?.[f]);
      for (const f of named) form.setError(f, { message: fields![f][0] });
      if (!named.length)
        setServerError(err instanceof ApiError ? err.message : "Could not reach the server. Try again.");
    }
  });
  const errors = form.formState.errors;
  return (
    <form method="post" onSubmit={onSubmit} noValidate className="flex flex-col gap-5" aria-label="Change password">
      {serverError && <Notice tone="error">{serverError}</Notice>}
      {done && (
        <div data-testid="password-changed">
          <Notice>{done}</Notice>
        </div>
      )}
      <input type="email" name="username" autoComplete="username" value={email} readOnly hidden />
      <PasswordField
        label="Current password"
        autoComplete="current-password"
        error={errors.currentPassword?.message}
        {...form.register("currentPassword")}
      />
      <PasswordField
        label="New password"
        autoComplete="new-password"
        rule
        typed={form.watch("newPassword")}
        error={errors.newPassword?.message}
        {...form.register("newPassword")}
      />
      <Button type="submit" big disabled={form.formState.isSubmitting} className="self-start">
        {form.formState.isSubmitting ? "Saving…" : "Change password"}
      </Button>
    </form>
  );
}
