import { forwardRef, useId, type InputHTMLAttributes } from "react";

type Props = InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; hint?: string };

export const TextField = forwardRef<HTMLInputElement, Props>(function TextField(
  { label, error, hint, className = "", ...props },
  ref,
) {
  const id = useId();
  return (
    <label htmlFor={id} className="flex flex-col gap-1.5">
      <span className="font-medium">{label}</span>
      <input
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-err` : hint ? `${id}-hint` : undefined}
        className={`min-h-12 rounded-tool border-2 bg-paper px-3 text-lg ${error ? "border-fail" : "border-rule"} ${className}`}
        {...props}
      />
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
    </label>
  );
});
