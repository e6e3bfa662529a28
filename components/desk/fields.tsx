"use client";

import { forwardRef, useId, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from "react";
import type { FieldError, FieldErrorsImpl, Merge } from "react-hook-form";
import { Notice } from "@/components/ui/notice";
import { ApiError } from "@/lib/client/api";

// Form pieces for the office screens (desktop first, still large enough for a tablet).
// Numbers are typed as text and turned into numbers by `asNumber`, so "4.030" keeps what the
// lead typed and a wrong entry ("4,03") shows an error instead of silently becoming empty.

/** For register(): empty → null, anything else → Number (NaN is refused by the schema with a message). */
export const asNumber = {
  setValueAs: (v: unknown) =>
    v === "" || v === null || v === undefined ? null : typeof v === "number" ? v : Number(String(v).trim()),
};

type AnyError = FieldError | Merge<FieldError, FieldErrorsImpl> | undefined;
export const messageOf = (e: AnyError | { message?: unknown }): string | undefined =>
  e && typeof e.message === "string" ? e.message : undefined;

function Frame({
  id,
  label,
  error,
  hint,
  children,
  className = "",
}: {
  id: string;
  label: string;
  error?: string;
  hint?: ReactNode;
  children: ReactNode;
  className?: string;
}) {
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-sm font-medium">
        {label}
      </label>
      {children}
      {hint && !error && (
        <span id={`${id}-hint`} className="text-sm text-muted">
          {hint}
        </span>
      )}
      {error && (
        <span id={`${id}-err`} className="text-sm font-medium text-fail">
          {error}
        </span>
      )}
    </div>
  );
}

const box = (error?: string) =>
  `min-h-11 w-full rounded-tool border-2 bg-paper px-3 ${error ? "border-fail" : "border-rule"}`;
const described = (id: string, error?: string, hint?: ReactNode) =>
  error ? `${id}-err` : hint ? `${id}-hint` : undefined;

type InputProps = React.InputHTMLAttributes<HTMLInputElement> & {
  label: string;
  error?: string;
  hint?: ReactNode;
  suffix?: string;
  wrapClass?: string;
};

export const Field = forwardRef<HTMLInputElement, InputProps>(function Field(
  { label, error, hint, suffix, wrapClass, className = "", ...props },
  ref,
) {
  const id = useId();
  return (
    <Frame id={id} label={label} error={error} hint={hint} className={wrapClass}>
      <span className="flex items-center gap-2">
        <input
          id={id}
          ref={ref}
          aria-invalid={error ? true : undefined}
          aria-describedby={described(id, error, hint)}
          className={`${box(error)} ${className}`}
          {...props}
        />
        {suffix && <span className="shrink-0 text-sm text-muted">{suffix}</span>}
      </span>
    </Frame>
  );
});

/** A number typed as text; register it with { ...asNumber }. */
export const NumberField = forwardRef<HTMLInputElement, InputProps>(function NumberField(props, ref) {
  return (
    <Field
      ref={ref}
      inputMode="decimal"
      autoComplete="off"
      spellCheck={false}
      className="font-mono tabular"
      {...props}
    />
  );
});

type SelectProps = SelectHTMLAttributes<HTMLSelectElement> & {
  label: string;
  error?: string;
  hint?: ReactNode;
  wrapClass?: string;
  children: ReactNode;
};

export const SelectField = forwardRef<HTMLSelectElement, SelectProps>(function SelectField(
  { label, error, hint, wrapClass, children, ...props },
  ref,
) {
  const id = useId();
  return (
    <Frame id={id} label={label} error={error} hint={hint} className={wrapClass}>
      <select
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={described(id, error, hint)}
        className={box(error)}
        {...props}
      >
        {children}
      </select>
    </Frame>
  );
});

type AreaProps = TextareaHTMLAttributes<HTMLTextAreaElement> & {
  label: string;
  error?: string;
  hint?: ReactNode;
  wrapClass?: string;
};

export const AreaField = forwardRef<HTMLTextAreaElement, AreaProps>(function AreaField(
  { label, error, hint, wrapClass, className = "", ...props },
  ref,
) {
  const id = useId();
  return (
    <Frame id={id} label={label} error={error} hint={hint} className={wrapClass}>
      <textarea
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={described(id, error, hint)}
        className={`${box(error)} py-2 ${className}`}
        {...props}
      />
    </Frame>
  );
});

export const CheckField = forwardRef<HTMLInputElement, React.InputHTMLAttributes<HTMLInputElement> & { label: string }>(
  function CheckField({ label, ...props }, ref) {
    return (
      <label className="flex min-h-11 items-center gap-2 text-sm font-medium">
        <input type="checkbox" ref={ref} className="h-5 w-5 accent-steel" {...props} />
        {label}
      </label>
    );
  },
);

/** What went wrong with a request, in words; field errors are shown beside their fields. */
export function ServerError({ error }: { error: unknown }) {
  if (!error) return null;
  const message =
    error instanceof ApiError
      ? error.message
      : "Could not reach the server. Check the connection and try again; nothing you typed is lost.";
  const fields = error instanceof ApiError ? error.fields : undefined;
  return (
    <Notice tone="error" title="Not saved">
      <p>{message}</p>
      {fields && (
        <ul className="mt-1 list-disc pl-5">
          {Object.entries(fields).map(([path, msgs]) => (
            <li key={path}>
              <span className="font-mono">{path}</span>: {msgs.join("; ")}
            </li>
          ))}
        </ul>
      )}
    </Notice>
  );
}

/** Loading, failed and empty states, the same on every office screen. */
export function Loading({ what }: { what: string }) {
  return (
    <p role="status" className="rounded-tool border-2 border-dashed border-rule p-6 text-muted">
      Loading {what}…
    </p>
  );
}

export function LoadFailed({ what, error, retry }: { what: string; error: unknown; retry: () => void }) {
  return (
    <Notice tone="error" title={`Could not load ${what}`}>
      <p>{error instanceof Error ? error.message : "The server did not answer."}</p>
      <button
        type="button"
        onClick={retry}
        className="mt-2 min-h-11 rounded-tool border-2 border-fail px-4 font-semibold"
      >
        Try again
      </button>
    </Notice>
  );
}

/** Puts a 422's field errors beside their fields ("engine.cylinders" → that input); true when any matched. */
export function applyFieldErrors(
  error: unknown,
  setError: (name: never, e: { type: string; message: string }) => void,
): boolean {
  if (!(error instanceof ApiError) || !error.fields) return false;
  let any = false;
  for (const [path, msgs] of Object.entries(error.fields)) {
    if (path === "_") continue;
    setError(path as never, { type: "server", message: msgs.join("; ") });
    any = true;
  }
  return any;
}
