"use client";

import { useCallback, useMemo, useRef, type ReactNode } from "react";
import { useGaugeKeys } from "@/hooks/use-gauge-keys";
import { createEntryStore } from "@/hooks/use-entry-store";
import { EntryField } from "@/components/bench/entry-field";
import { applyKey, Keypad, type PadKey } from "@/components/bench/keypad";

// The bench's glove-proof entry for a gauge study: the figure large, the glove keypad, and a
// gauge that types its figure and Enter straight into it (the same pieces as a job's stations).
interface Props {
  label: string;
  hint: string;
  unit: string;
  gaugeLine: ReactNode;
  placeholder: string;
  /** Keeps the figure; answers words saying what to fix, or nothing when it was kept. */
  onSave: (text: string) => Promise<string | undefined>;
  disabled?: boolean;
  children?: ReactNode;
}

export function StudyPad({ label, hint, unit, gaugeLine, placeholder, onSave, disabled, children }: Props) {
  const store = useMemo(() => createEntryStore(), []);
  const input = useRef<HTMLInputElement>(null);
  const busy = useRef(false);
  const refocus = useGaugeKeys({ input, store, typingSheetOpen: () => false, closeOtherSheet: () => {} });
  const focus = useCallback(() => input.current?.focus({ preventScroll: true }), []);
  const save = useCallback(async () => {
    if (busy.current) return;
    busy.current = true;
    try {
      const error = await onSave(store.get().draft);
      // Refused: the typed text stays, with the words; kept: the field empties for the next one.
      store.set(error ? { error } : { draft: "", error: undefined });
    } finally {
      busy.current = false;
      focus();
    }
  }, [onSave, store, focus]);
  const onKey = useCallback(
    (k: PadKey) => {
      store.set({ draft: applyKey(store.get().draft, k), error: undefined });
      focus();
    },
    [store, focus],
  );
  return (
    <section className="flex flex-col gap-2.5" aria-label="Entry" onClick={refocus}>
      <EntryField
        ref={input}
        store={store}
        onEnter={() => void save()}
        unit={unit}
        label={label}
        hint={hint}
        gauge={gaugeLine}
        placeholder={placeholder}
        disabled={disabled}
      />
      <Keypad onKey={onKey} onEnter={() => void save()} disabled={disabled} />
      {children}
    </section>
  );
}
