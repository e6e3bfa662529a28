"use client";

import { useEffect, useState } from "react";

/** Runs `fn` once the browser has painted the next frame (a timer queued from requestAnimationFrame). */
export function afterPaint(fn: () => void): () => void {
  if (typeof requestAnimationFrame !== "function") {
    const t = setTimeout(fn, 16);
    return () => clearTimeout(t);
  }
  let t: ReturnType<typeof setTimeout> | undefined;
  const raf = requestAnimationFrame(() => (t = setTimeout(fn, 0)));
  return () => {
    cancelAnimationFrame(raf);
    clearTimeout(t);
  };
}

/** Runs `fn` when the page is idle (or after `timeoutMs` at the latest): for work no screen waits on. */
export function whenIdle(fn: () => void, timeoutMs = 1500): () => void {
  if (typeof requestIdleCallback !== "function") {
    const t = setTimeout(fn, 200);
    return () => clearTimeout(t);
  }
  const id = requestIdleCallback(fn, { timeout: timeoutMs });
  return () => cancelIdleCallback(id);
}

/**
 * Runs `fn` once the page has settled: `delayMs` after now, then when idle. For code the screen
 * does not need to take an entry (the sync engine, the pack refresh): it loads after the screen
 * is up instead of competing with it, which keeps it out of the first-load JavaScript (bench:bundle).
 */
export function whenSettled(fn: () => void, delayMs = 1000): () => void {
  let cancelIdle = () => {};
  const t = setTimeout(() => (cancelIdle = whenIdle(fn)), delayMs);
  return () => {
    clearTimeout(t);
    cancelIdle();
  };
}

/**
 * `value`, but a changed value reaches the screen only after the frame in flight has painted.
 * The bench uses it for the job's readings: the verdict of an entry paints first, and the heavier
 * recomputation of the route and derived values follows in the next frame.
 */
export function useAfterPaint<T>(value: T): T {
  const [shown, setShown] = useState(value);
  useEffect(() => (Object.is(value, shown) ? undefined : afterPaint(() => setShown(() => value))), [value, shown]);
  return shown;
}
