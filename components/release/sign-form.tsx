"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { TextField } from "@/components/ui/text-field";
import { ApiError } from "@/lib/client/api";
import { signSchema, type SignInput } from "@/lib/schemas/release";
import { useSign } from "./release-queries";

// The inspector's e-signature: full name typed as on the account (capital letters do not
// matter) and the password again. What was typed stays after a refusal; only the password clears.
export function SignForm({
  jobId,
  jobCode,
  accountName,
  ready,
}: {
  jobId: number;
  jobCode: string;
  accountName: string;
  ready: boolean;
}) {
  const sign = useSign(jobId);
  const [problem, setProblem] = useState<{ message: string; items?: string[] } | null>(null);
  const form = useForm<SignInput>({ resolver: zodResolver(signSchema), defaultValues: { fullName: "", password: "" } });

  const onSubmit = form.handleSubmit(async (values) => {
    setProblem(null);
    try {
      await sign.mutateAsync(values);
      form.reset();
    } catch (err) {
      form.setValue("password", "");
      if (!(err instanceof ApiError))
        return setProblem({
          message: "Could not reach the server; nothing was signed. Check the connection and try again.",
        });
      for (const k of ["fullName", "password"] as const)
        if (err.fields?.[k]) form.setError(k, { message: err.fields[k][0] });
      setProblem({ message: err.message, items: err.fields?.checklist });
    }
  });

  return (
    <section aria-labelledby="sign-h" className="flex flex-col gap-4 rounded-tool border-2 border-steel bg-panel p-4">
      <h2 id="sign-h" className="text-xl font-semibold">
        Sign the release of {jobCode}
      </h2>
      {!ready && (
        <Notice title="Not ready to sign">
          Clear every item on the checklist first; the form opens when nothing blocks release.
        </Notice>
      )}
      <p className="text-sm">
        Signing says you checked this record and release the block for assembly. The readings are then locked, and a
        fingerprint of the whole record (every reading with its history, the limits, the flag decisions and the gauges)
        is stored with your signature.
      </p>
      {problem && (
        <Notice tone="error" title={problem.message}>
          {problem.items && (
            <ul className="ml-4 list-disc">
              {problem.items.map((t) => (
                <li key={t}>{t}</li>
              ))}
            </ul>
          )}
        </Notice>
      )}
      <form onSubmit={onSubmit} noValidate className="grid gap-4 md:grid-cols-2">
        <TextField
          label="Your full name"
          autoComplete="name"
          hint={`As on your account: ${accountName} (capital letters do not matter)`}
          disabled={!ready}
          error={form.formState.errors.fullName?.message}
          {...form.register("fullName")}
        />
        <TextField
          label="Your password"
          type="password"
          autoComplete="current-password"
          hint="The one you sign in with"
          disabled={!ready}
          error={form.formState.errors.password?.message}
          {...form.register("password")}
        />
        <div className="md:col-span-2">
          <Button type="submit" big disabled={!ready || form.formState.isSubmitting}>
            {form.formState.isSubmitting ? "Signing…" : "Sign and release"}
          </Button>
        </div>
      </form>
    </section>
  );
}
