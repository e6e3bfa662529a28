"use client";

import { memo, useState, type ChangeEvent } from "react";
import type { PhotoOwner } from "@/lib/offline/photos";
import { useDexieQuery } from "@/hooks/use-dexie-query";
import { useBench } from "./bench-context";

// A photo from the tablet's camera (a scored bore, a spun bearing), kept on the tablet until
// the server has it. Attached to the station's current reading, else to the job.
export const PhotoButton = memo(function PhotoButton({
  owner,
  jobId,
  onDone,
}: {
  owner: PhotoOwner;
  jobId: number;
  /** After the camera has closed: the entry field takes the focus back. */
  onDone: () => void;
}) {
  const { db, engine, actor } = useBench();
  const [error, setError] = useState<string>();
  const [waiting] = useDexieQuery(
    db,
    ["photos"],
    () =>
      db.photos
        .where("jobId")
        .equals(jobId)
        .filter((p) => p.state === "pending")
        .count(),
    [jobId],
    0,
  );
  async function onFile(e: ChangeEvent<HTMLInputElement>) {
    const file = e.target.files?.[0];
    e.target.value = "";
    onDone();
    if (!file) return;
    try {
      const { addPhoto } = await import("@/lib/offline/photos");
      await addPhoto(db, file, owner, actor.userId);
      setError(undefined);
      engine.afterEntry();
    } catch (err) {
      setError(err instanceof Error ? err.message : String(err));
    }
  }
  return (
    <div className="flex flex-col gap-1">
      <label
        className={
          "flex min-h-16 cursor-pointer items-center justify-center gap-2 rounded-tool border-2 border-rule bg-panel " +
          "px-4 text-lg font-semibold"
        }
      >
        <svg width="22" height="22" viewBox="0 0 22 22" aria-hidden="true">
          <rect x="2" y="6" width="18" height="13" rx="2" fill="none" stroke="currentColor" strokeWidth="2" />
          <circle cx="11" cy="12.5" r="3.5" fill="none" stroke="currentColor" strokeWidth="2" />
          <path d="M7 6 8.5 3h5L15 6" fill="none" stroke="currentColor" strokeWidth="2" />
        </svg>
        Photo{waiting > 0 ? ` (${waiting} to send)` : ""}
        <input type="file" accept="image/*" capture="environment" className="sr-only" onChange={onFile} />
      </label>
      {error && (
        <p className="text-sm font-semibold text-fail" role="alert">
          {error}
        </p>
      )}
    </div>
  );
});
