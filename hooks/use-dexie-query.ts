"use client";

import Dexie from "dexie";
import { useEffect, useRef, useState, type DependencyList } from "react";
import type { BenchDb } from "@/lib/offline/db";

/**
 * A live read of the bench database: runs `query`, and again (on the next task) whenever a
 * committed write touched one of `tables`. Unlike Dexie's liveQuery it never runs inside the
 * writer's commit event, so an entry learns its reading is safe before any screen re-reads.
 * A failing query keeps the last good value and is reported in `error`, never swallowed.
 */
export function useDexieQuery<T>(
  db: BenchDb,
  tables: string[],
  query: () => Promise<T>,
  deps: DependencyList,
  initial: T,
): [T, Error | undefined];
export function useDexieQuery<T>(
  db: BenchDb,
  tables: string[],
  query: () => Promise<T>,
  deps: DependencyList,
): [T | undefined, Error | undefined];
export function useDexieQuery<T>(
  db: BenchDb,
  tables: string[],
  query: () => Promise<T>,
  deps: DependencyList,
  initial?: T,
) {
  const [state, setState] = useState<{ value: T | undefined; error?: Error }>({ value: initial });
  const latest = useRef(query);
  latest.current = query;
  const key = tables.join(",");
  useEffect(() => {
    let alive = true;
    let timer: ReturnType<typeof setTimeout> | undefined;
    const run = () =>
      latest.current().then(
        (value) => alive && setState({ value }),
        (err: unknown) =>
          alive && setState((s) => ({ value: s.value, error: err instanceof Error ? err : new Error(String(err)) })),
      );
    const prefixes = key.split(",").map((t) => `idb://${db.name}/${t}/`);
    const onMutated = (parts: Record<string, unknown>) => {
      if (!Object.keys(parts).some((p) => prefixes.some((x) => p.startsWith(x)))) return;
      clearTimeout(timer);
      timer = setTimeout(run, 0);
    };
    void run();
    Dexie.on("storagemutated", onMutated);
    return () => {
      alive = false;
      clearTimeout(timer);
      Dexie.on("storagemutated").unsubscribe(onMutated);
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps -- `deps` are the caller's query inputs
  }, [db, key, ...deps]);
  return [state.value, state.error];
}
