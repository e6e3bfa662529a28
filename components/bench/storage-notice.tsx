"use client";

import { useEffect, useState } from "react";

// Asks the browser to keep the tablet's data for good (navigator.storage.persist()). Without
// that promise a browser may clear site data when space runs low, so the machinist is told.
type Kept = "asking" | "kept" | "refused" | "unsupported";

export function StorageNotice() {
  const [kept, setKept] = useState<Kept>("asking");
  useEffect(() => {
    const storage = navigator.storage;
    if (!storage?.persist) return setKept("unsupported");
    storage
      .persisted()
      .then((already) => (already ? true : storage.persist()))
      .then(
        (ok) => setKept(ok ? "kept" : "refused"),
        () => setKept("refused"),
      );
  }, []);
  if (kept === "kept" || kept === "asking")
    return (
      <span className="sr-only" data-testid="storage" data-kept={kept}>
        Storage {kept}
      </span>
    );
  return (
    <p
      className="flex items-start gap-2 text-sm leading-snug font-medium text-watch"
      data-testid="storage"
      data-kept={kept}
    >
      <svg width="18" height="18" viewBox="0 0 18 18" aria-hidden="true" className="mt-0.5 shrink-0">
        <path d="M9 1.5 17 16H1Z" fill="currentColor" />
        <path d="M9 6.5v4.5M9 13.3v.2" stroke="white" strokeWidth="2.2" strokeLinecap="round" />
      </svg>
      {kept === "refused"
        ? "This browser has not promised to keep the bench's data: install Tenthwise to the home screen and send readings often."
        : "This browser cannot promise to keep the bench's data: send readings often."}
    </p>
  );
}
