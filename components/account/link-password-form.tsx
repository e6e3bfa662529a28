"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { api, ApiError } from "@/lib/client/api";
import { setPasswordSchema, type SetPasswordInput } from "@/lib/schemas/password";
import { bigButtonLink } from "./auth-frame";
import { PasswordField } from "./password-field";

type Kind = "invitation" | "password_reset";
const ROUTE: Record<Kind, string> = { invitation: "/api/password/set", password_reset: "/api/password/reset" };

// The form behind an e-mailed link: the person chooses a password; the server checks it against
// the common-password list and uses the link up only when it takes the password.
export function LinkPasswordForm({ kind, token, email }: { kind: Kind; token: string; email: string }) {
  const [serverError, setServerError] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const form = useForm<SetPasswordInput>({
    resolver: zodResolver(setPasswordSchema),
    defaultValues: { token, password: "" },
  });
  const onSubmit = form.handleSubmit(async (values) => {
    setServerError(null);
    try {
      await api(ROUTE[kind], { method: "POST", json: values });
      setDone(true);
    } catch (err) {
      if (err instanceof ApiError && err.fields?.password)
        form.setError("password", { message: err.fields.password[0] });
      else setServerError(err instanceof ApiError ? err.message : "Could not reach the server. Try again.");
    }
  });
  if (done)
    return (
      <div className="flex flex-col gap-4" data-testid="password-set">
        <Notice title="Your password is set">
          Sign in with {email} and the password you just chose.
          {kind === "password_reset" && " Every device that was signed in to your account has been signed out."}
        </Notice>
        <a href="/sign-in" className={bigButtonLink}>
          Go to sign-in
        </a>
      </div>
    );
  return (
    <form method="post" onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {serverError && <Notice tone="error">{serverError}</Notice>}
      <p className="text-muted">
        You sign in as <span className="font-semibold text-ink">{email}</span>.
      </p>
      <input type="email" name="username" autoComplete="username" value={email} readOnly hidden />
      <PasswordField
        label="New password"
        autoComplete="new-password"
        rule
        typed={form.watch("password")}
        error={form.formState.errors.password?.message}
        {...form.register("password")}
      />
      <Button type="submit" big disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? "Saving…" : "Save my password"}
      </Button>
    </form>
  );
}
