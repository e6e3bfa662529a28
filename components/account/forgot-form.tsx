"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { TextField } from "@/components/ui/text-field";
import { api, ApiError } from "@/lib/client/api";
import type { z } from "zod";
import { forgotPasswordSchema } from "@/lib/schemas/password";

type Values = z.input<typeof forgotPasswordSchema>;

// Asks for a reset link. The answer is the same whether or not the address has an account.
export function ForgotForm() {
  const [answer, setAnswer] = useState<string | null>(null);
  const [serverError, setServerError] = useState<string | null>(null);
  const form = useForm<Values, unknown, z.output<typeof forgotPasswordSchema>>({
    resolver: zodResolver(forgotPasswordSchema),
    defaultValues: { email: "" },
  });
  const onSubmit = form.handleSubmit(async (values) => {
    setServerError(null);
    try {
      const res = await api<{ message: string }>("/api/password/forgot", { method: "POST", json: values });
      setAnswer(res.message);
    } catch (err) {
      setServerError(err instanceof ApiError ? err.message : "Could not reach the server. Try again.");
    }
  });
  if (answer)
    return (
      <div data-testid="forgot-answer">
        <Notice title="Check your e-mail">{answer}</Notice>
      </div>
    );
  return (
    <form method="post" onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {serverError && <Notice tone="error">{serverError}</Notice>}
      <TextField
        label="Your e-mail"
        type="email"
        autoComplete="username"
        error={form.formState.errors.email?.message}
        {...form.register("email")}
      />
      <Button type="submit" big disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? "Sending…" : "Send me a reset link"}
      </Button>
    </form>
  );
}
