"use client";

import { useSerwist } from "@serwist/next/react";
import { useEffect, useState } from "react";
import { Button } from "@/components/ui/button";
import { useDexieQuery } from "@/hooks/use-dexie-query";
import { useBench } from "./bench-context";

// A new version of the app is installed but waits (the worker does not skip waiting). It is
// offered here and applied only when nothing is left in the outbox, so an update can never
// come between a reading and the server. Readings live in IndexedDB and survive it anyway.
export function UpdateBanner() {
  const { serwist } = useSerwist();
  const { db } = useBench();
  const [waiting, setWaiting] = useState(false);
  // Watched only while an update waits, so entries do not pay for this query the rest of the time.
  const [queued] = useDexieQuery(
    db,
    ["outbox"],
    () => (waiting ? db.outbox.count() : Promise.resolve(0)),
    [waiting],
    0,
  );

  useEffect(() => {
    if (!serwist) return;
    const onWaiting = () => setWaiting(true);
    // Only an update that the machinist applied reloads; the first install just takes control.
    const onControlling = (e: { isUpdate?: boolean }) => {
      if (e.isUpdate) window.location.reload();
    };
    serwist.addEventListener("waiting", onWaiting);
    serwist.addEventListener("controlling", onControlling);
    return () => {
      serwist.removeEventListener("waiting", onWaiting);
      serwist.removeEventListener("controlling", onControlling);
    };
  }, [serwist]);

  if (!waiting || !serwist) return null;
  async function apply() {
    if ((await db.outbox.count()) > 0) return;
    serwist?.messageSkipWaiting();
  }
  return (
    <div
      className="flex flex-wrap items-center gap-3 rounded-tool border-2 border-steel bg-panel px-4 py-2"
      role="status"
      data-testid="update-banner"
    >
      <span className="font-semibold">A new version of Tenthwise is ready.</span>
      {queued > 0 ? (
        <span className="text-sm text-muted">
          It will be offered once the {queued} waiting reading{queued === 1 ? " is" : "s are"} sent.
        </span>
      ) : (
        <Button onClick={apply} className="min-h-12">
          Update now
        </Button>
      )}
    </div>
  );
}
