"use client";

import { useSyncExternalStore } from "react";
import type { MeasureUnit, Verdict } from "@/lib/domain";

// The entry's fast-changing state (the text being typed, its error, the last verdict) in a tiny
// store outside React state, so a keystroke or an Enter repaints only the readout and the
// verdict card, never the whole job screen. This is what keeps Enter-to-verdict near the floor
// that bench:entry measures, and typing smooth on a slow tablet.
export interface LastEntry {
  seq: number;
  stationId: string;
  label: string;
  value: number | null;
  unit: MeasureUnit;
  verdict?: Verdict;
  deviation?: number;
  deviationUnit?: MeasureUnit;
  note?: string;
  /** Torque entries: the lubricant, in words. */
  lubricant?: string;
  skipped?: boolean;
  stayed: boolean;
}

export interface EntryState {
  draft: string;
  error?: string;
  /** A question the next Save answers (a correction of a kept reading); cleared by typing. */
  ask?: string;
  last?: LastEntry;
}

export interface EntryStore {
  get(): EntryState;
  set(patch: Partial<EntryState>): void;
  subscribe(onChange: () => void): () => void;
}

export function createEntryStore(): EntryStore {
  let state: EntryState = { draft: "" };
  const subscribers = new Set<() => void>();
  return {
    get: () => state,
    set(patch) {
      state = { ...state, ...patch };
      for (const fn of subscribers) fn();
    },
    subscribe(fn) {
      subscribers.add(fn);
      return () => void subscribers.delete(fn);
    },
  };
}

/** One field of the entry state; the component re-renders only when that field changes. */
export function useEntryField<K extends keyof EntryState>(store: EntryStore, key: K): EntryState[K] {
  return useSyncExternalStore(
    store.subscribe,
    () => store.get()[key],
    () => store.get()[key],
  );
}
