"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { TextField } from "@/components/ui/text-field";
import { useOnline } from "@/hooks/use-online";
import { api, ApiError } from "@/lib/client/api";
import { signInSchema, type SignInInput } from "@/lib/schemas/session";

export function SignInForm({ next }: { next?: string }) {
  const [serverError, setServerError] = useState<string | null>(null);
  const online = useOnline();
  const form = useForm<SignInInput>({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: "", password: "" },
  });

  const onSubmit = form.handleSubmit(async (values) => {
    setServerError(null);
    try {
      const res = await api<{ home: string; mustChangePassword: boolean }>("/api/session", {
        method: "POST",
        json: values,
      });
      // A temporary password is changed before anything else, wherever the person was heading.
      window.location.assign(res.mustChangePassword ? res.home : (next ?? res.home));
    } catch (err) {
      // Keep what was typed; only the password is cleared after a refusal.
      setServerError(
        err instanceof ApiError ? err.message : "Could not reach the server. Check the connection and try again.",
      );
      form.setValue("password", "");
      form.setFocus("password");
    }
  });

  return (
    // method="post": a tap before hydration must never put the password into the URL.
    <form
      method="post"
      onSubmit={onSubmit}
      noValidate
      className="flex flex-col gap-5 rounded-tool border-2 border-rule bg-panel p-6"
    >
      <h1 className="text-2xl font-semibold">Sign in</h1>
      {!online && (
        <div data-testid="sign-in-offline">
          <Notice title="This device is offline">
            Signing in needs the shop&apos;s server. Connect to the shop network, then sign in. Readings already entered
            stay on this tablet.
          </Notice>
        </div>
      )}
      {serverError && <Notice tone="error">{serverError}</Notice>}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="username"
        error={form.formState.errors.email?.message}
        {...form.register("email")}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        error={form.formState.errors.password?.message}
        {...form.register("password")}
      />
      <Button type="submit" big disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? "Signing in…" : "Sign in"}
      </Button>
      <a
        href="/forgot-password"
        className="inline-flex min-h-11 items-center self-start font-medium text-steel underline underline-offset-4"
      >
        Forgot your password?
      </a>
    </form>
  );
}
