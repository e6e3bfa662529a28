"use client";

import { useCallback, useEffect, useRef, type RefObject } from "react";
import { cleanTyped } from "@/lib/offline/entry";
import type { EntryStore } from "./use-entry-store";

// A gauge that types (a USB or Bluetooth keyboard wedge) sends its figure as keystrokes into
// whatever has the focus, so on the bench the entry field keeps it: after every tap the field
// takes the focus back, and a figure's first keystroke typed while something else has it (a
// button, the page itself) is put into the field, which then has the focus for the rest and the
// Enter. The field's inputMode="none" keeps the on-screen keyboard away when it is focused.
const GAUGE_KEY = /^[0-9.,+-]$/;
const NOT_TYPED_INTO = new Set(["button", "checkbox", "radio", "file", "range", "submit", "reset", "color", "image"]);

/** Whether the element takes typed text itself (another field, a text area, a list). */
export function takesTyping(el: Element | null): boolean {
  if (!el) return false;
  if (el instanceof HTMLInputElement) return !NOT_TYPED_INTO.has(el.type);
  return el instanceof HTMLTextAreaElement || el instanceof HTMLSelectElement || (el as HTMLElement).isContentEditable;
}

interface Args {
  input: RefObject<HTMLInputElement | null>;
  store: EntryStore;
  /** A sheet that holds typing of its own is open (the skip reason): keys stay with it. */
  typingSheetOpen: () => boolean;
  /** Closes a sheet that does not take typing (all stations), so the figure shows where it goes. */
  closeOtherSheet: () => void;
}

/** Returns the tap handler for the bench screen; installs the keystroke forwarding while mounted. */
export function useGaugeKeys({ input, store, typingSheetOpen, closeOtherSheet }: Args) {
  const args = useRef({ typingSheetOpen, closeOtherSheet });
  args.current = { typingSheetOpen, closeOtherSheet };

  const canTake = useCallback(() => {
    const field = input.current;
    if (!field || field.disabled || args.current.typingSheetOpen()) return undefined;
    const active = document.activeElement;
    if (active !== field && takesTyping(active)) return undefined;
    return field;
  }, [input]);

  useEffect(() => {
    function onKeyDown(e: KeyboardEvent) {
      if (e.defaultPrevented || e.ctrlKey || e.metaKey || e.altKey || e.isComposing) return;
      if (!GAUGE_KEY.test(e.key)) return;
      const field = canTake();
      if (!field || e.target === field) return;
      e.preventDefault();
      args.current.closeOtherSheet();
      field.focus({ preventScroll: true });
      store.set({ draft: cleanTyped(store.get().draft + e.key), error: undefined, ask: undefined });
    }
    document.addEventListener("keydown", onKeyDown);
    return () => document.removeEventListener("keydown", onKeyDown);
  }, [canTake, store]);

  // After the tap's own work has rendered (a sheet opened, a gauge picked), the field takes the
  // focus back unless the tap opened something that takes typing.
  return useCallback(() => {
    setTimeout(() => canTake()?.focus({ preventScroll: true }), 0);
  }, [canTake]);
}
