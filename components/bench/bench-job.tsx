"use client";

import { useSearchParams } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { Notice } from "@/components/ui/notice";
import { useAfterPaint, whenSettled } from "@/hooks/use-after-paint";
import { useDexieQuery } from "@/hooks/use-dexie-query";
import type { JobPack } from "@/lib/schemas/sync";
import { getJobPrefs } from "@/lib/offline/meta";
import { readingsOfJob } from "@/lib/offline/readings";
import { useBench } from "./bench-context";
import { JobScreen } from "./job-screen";

// Opens a job from the tablet's own store at once; when the server answers, the pack is
// refreshed in the background (spec edits, other tablets' readings, the lead's dispositions).
export function BenchJob() {
  const id = Number(useSearchParams().get("id"));
  const { db } = useBench();
  const [fetchError, setFetchError] = useState<string>();
  const [row, rowError] = useDexieQuery(db, ["jobs"], () => db.jobs.get(id).then((r) => r ?? null), [id]);
  // A new reading repaints the route and derived values only after its verdict has painted.
  const [live, readError] = useDexieQuery(db, ["readings"], () => readingsOfJob(db, id), [id]);
  const readings = useAfterPaint(live);
  const [prefs] = useDexieQuery(db, ["meta"], () => getJobPrefs(db, id), [id]);
  const storeError = rowError ?? readError;

  const loaded = row !== undefined;
  const onTablet = !!row;
  const refreshed = useRef<number>(undefined);
  useEffect(() => {
    if (!Number.isInteger(id) || id <= 0 || !loaded || refreshed.current === id) return;
    refreshed.current = id;
    let stop = false;
    let cancel = () => {};
    // A job already on the tablet shows from its store first; the refresh (and its code) follows
    // once the screen has settled. A job not on the tablet yet is fetched at once.
    let started = false;
    const refresh = () => {
      started = true;
      return Promise.all([import("@/lib/offline/transport"), import("@/lib/offline/packs")])
        .then(([{ getJson }, { savePack }]) =>
          getJson<JobPack>(fetch, `/api/bench/jobs/${id}`).then((pack) => savePack(db, pack)),
        )
        .then(() => !stop && setFetchError(undefined))
        .catch(async (err: unknown) => {
          const { ActionError } = await import("@/lib/offline/transport");
          if (stop) return;
          const gone = err instanceof ActionError && err.status === 404;
          setFetchError(
            gone
              ? "This job is not on the server for your shop any more"
              : err instanceof ActionError
                ? err.message
                : "offline",
          );
        });
    };
    if (onTablet) cancel = whenSettled(() => void refresh());
    else void refresh();
    return () => {
      stop = true;
      cancel();
      if (!started) refreshed.current = undefined; // cancelled before it began: let it run again
    };
  }, [db, id, loaded, onTablet]);

  if (!Number.isInteger(id) || id <= 0) {
    return (
      <main className="mx-auto max-w-3xl px-4 py-8">
        <Notice tone="error">
          No job was picked. Go back to the{" "}
          <a className="underline" href="/bench">
            job list
          </a>{" "}
          and open one.
        </Notice>
      </main>
    );
  }
  if (storeError && (row === undefined || readings === undefined)) {
    return (
      <main className="mx-auto max-w-3xl px-4 py-8">
        <Notice tone="error" title="The tablet's storage could not be read">
          {storeError.message}. Reload the page; nothing saved is lost.
        </Notice>
      </main>
    );
  }
  if (row === undefined || readings === undefined || prefs === undefined)
    return <main className="px-4 py-8 text-lg text-muted">Opening the job…</main>;
  if (row === null) {
    return (
      <main className="mx-auto max-w-3xl px-4 py-8">
        <Notice tone="error" title="This job is not on the tablet yet">
          {fetchError && fetchError !== "offline" ? `${fetchError}. ` : "Connect to the network once to download it. "}
          <a className="font-semibold underline" href="/bench">
            Back to the job list
          </a>
        </Notice>
      </main>
    );
  }
  return (
    <>
      {fetchError && fetchError !== "offline" && (
        <div className="mx-auto max-w-7xl px-4 pt-3">
          <Notice tone="error">{fetchError}</Notice>
        </div>
      )}
      <JobScreen key={row.jobId} pack={row.pack} readings={readings} prefs={prefs} />
    </>
  );
}
