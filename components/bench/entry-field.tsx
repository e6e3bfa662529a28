"use client";

import { forwardRef, type KeyboardEvent } from "react";
import { cleanTyped } from "@/lib/offline/entry";

// The value being entered, shown large with its unit. It is a real input so a gauge that types
// (digits, then Enter) or a physical keyboard works with no tap; inputMode="none" keeps the
// tablet's own on-screen keyboard away, since the glove keypad is right below.
interface Props {
  value: string;
  onChange: (v: string) => void;
  onEnter: () => void;
  unit: string;
  label: string;
  hint: string;
  error?: string;
  disabled?: boolean;
}

export const EntryField = forwardRef<HTMLInputElement, Props>(function EntryField({ value, onChange, onEnter, unit, label, hint, error, disabled }, ref) {
  function onKeyDown(e: KeyboardEvent<HTMLInputElement>) {
    if (e.key === "Enter") {
      e.preventDefault();
      onEnter();
    } else if (e.key === "Escape") {
      onChange("");
    }
  }
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor="tw-entry" className="text-sm font-semibold text-muted">{label}</label>
      <div className={`flex items-baseline gap-3 rounded-tool border-4 bg-panel px-4 py-2 ${error ? "border-fail" : "border-steel"}`}>
        <input
          id="tw-entry"
          ref={ref}
          value={value}
          onChange={(e) => onChange(cleanTyped(e.target.value))}
          onKeyDown={onKeyDown}
          inputMode="none"
          autoComplete="off"
          autoCorrect="off"
          spellCheck={false}
          disabled={disabled}
          placeholder="—"
          aria-invalid={error ? true : undefined}
          aria-describedby="tw-entry-note"
          data-testid="entry"
          className="w-full min-w-0 bg-transparent font-mono text-readout tabular text-ink outline-none placeholder:text-rule"
        />
        <span className="shrink-0 text-2xl font-semibold text-muted">{unit}</span>
      </div>
      <p id="tw-entry-note" className={`min-h-6 text-base ${error ? "font-semibold text-fail" : "text-muted"}`} role={error ? "alert" : undefined}>
        {error ?? hint}
      </p>
    </div>
  );
});
