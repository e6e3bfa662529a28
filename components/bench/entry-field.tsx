"use client";

import { forwardRef, useEffect, useImperativeHandle, useRef, type KeyboardEvent, type ReactNode } from "react";
import { useEntryField, type EntryStore } from "@/hooks/use-entry-store";
import { cleanTyped } from "@/lib/offline/entry";

// The value being entered, shown large with its unit and the gauge in use. It is a real input so
// a gauge that types (digits, then Enter) or a physical keyboard works with no tap;
// inputMode="none" keeps the tablet's own on-screen keyboard away (the glove keypad is below).
interface Props {
  store: EntryStore;
  onEnter: () => void;
  unit: string;
  label: string;
  hint: string;
  gauge: ReactNode;
  placeholder: string;
  disabled?: boolean;
}

export const EntryField = forwardRef<HTMLInputElement, Props>(function EntryField(
  { store, onEnter, unit, label, hint, gauge, placeholder, disabled },
  ref,
) {
  const error = useEntryField(store, "error");
  const ask = useEntryField(store, "ask");
  const input = useRef<HTMLInputElement>(null);
  useImperativeHandle(ref, () => input.current!, []);
  // Asked before a correction: the figure is selected, so a gauge's next figure replaces it.
  useEffect(() => {
    if (ask && document.activeElement === input.current) input.current?.select();
  }, [ask]);
  // The text lives in the store and is written straight into the input (not re-rendered by
  // React): a keystroke, a keypad tap or an Enter costs one DOM write, not a render.
  useEffect(() => {
    const show = () => {
      const { draft } = store.get();
      if (input.current && input.current.value !== draft) input.current.value = draft;
    };
    show();
    return store.subscribe(show);
  }, [store]);
  const onChange = (draft: string) => store.set({ draft, error: undefined, ask: undefined });
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
      <label htmlFor="tw-entry" className="truncate text-sm font-semibold text-muted">
        {label}
      </label>
      <div
        className={
          "rounded-tool border-4 bg-panel px-4 pb-1 pt-1 [contain:content] focus-within:border-brass " +
          (error ? "border-fail" : "border-steel")
        }
      >
        <div className="flex items-baseline gap-3">
          <input
            id="tw-entry"
            ref={input}
            defaultValue=""
            onChange={(e) => onChange(cleanTyped(e.target.value))}
            onKeyDown={onKeyDown}
            inputMode="none"
            autoComplete="off"
            autoCorrect="off"
            spellCheck={false}
            disabled={disabled}
            placeholder={placeholder}
            aria-invalid={error ? true : undefined}
            aria-describedby="tw-entry-note"
            data-testid="entry"
            // The box's brass border shows the focus (a gauge types only into a focused field).
            style={{ outline: "none" }}
            className="w-full min-w-0 bg-transparent font-mono text-[3.5rem] leading-tight tabular text-ink placeholder:text-rule"
          />
          <span className="shrink-0 text-2xl font-semibold text-muted">{unit}</span>
        </div>
        <div className="truncate text-sm text-muted">{gauge}</div>
      </div>
      <p
        id="tw-entry-note"
        className={`min-h-6 text-base leading-snug ${error ? "font-semibold text-fail" : ask ? "font-semibold" : "text-muted"}`}
        role={error || ask ? "alert" : undefined}
        data-testid="entry-note"
      >
        {error ?? ask ?? hint}
      </p>
    </div>
  );
});
