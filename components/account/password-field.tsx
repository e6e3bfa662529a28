"use client";

import { forwardRef, useState, type InputHTMLAttributes } from "react";
import { TextField } from "@/components/ui/text-field";
import { PASSWORD_MIN_LENGTH } from "@/lib/schemas/password";

type Props = InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; typed?: string; rule?: boolean };

// A password field with a large "show" switch (typing on a tablet is easier to check than dots)
// and, for a new password, the length rule counting as the person types.
export const PasswordField = forwardRef<HTMLInputElement, Props>(function PasswordField(
  { label, error, typed = "", rule = false, ...props },
  ref,
) {
  const [shown, setShown] = useState(false);
  const count = Array.from(typed).length;
  const hint = rule
    ? count >= PASSWORD_MIN_LENGTH
      ? `${count} characters: long enough.`
      : `At least ${PASSWORD_MIN_LENGTH} characters (${count} so far). A few words in a row works well.`
    : undefined;
  return (
    <div className="flex flex-col gap-2">
      <TextField ref={ref} label={label} type={shown ? "text" : "password"} error={error} hint={hint} {...props} />
      <label className="inline-flex min-h-11 items-center gap-3 self-start text-sm font-medium">
        <input type="checkbox" className="size-6" checked={shown} onChange={(e) => setShown(e.target.checked)} />
        Show what I typed
      </label>
    </div>
  );
});
