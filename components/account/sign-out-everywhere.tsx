"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { api, ApiError } from "@/lib/client/api";

// Ends every sign-in of this person, on every tablet and computer, this one included. This device
// then forgets who was signed in the same way the header's sign-out does (lib/offline/sign-out.ts).
export function SignOutEverywhere() {
  const [asking, setAsking] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function go() {
    setBusy(true);
    setError(null);
    try {
      await api("/api/me/sessions", { method: "DELETE" });
    } catch (err) {
      setBusy(false);
      return setError(err instanceof ApiError ? err.message : "Could not reach the server; nothing was changed.");
    }
    try {
      const [{ getBenchDb }, { signOutHere }] = await Promise.all([
        import("@/lib/offline/db"),
        import("@/lib/offline/sign-out"),
      ]);
      await signOutHere(getBenchDb());
    } finally {
      // A full load, as the header's sign-out does: nothing of the person who left stays in memory.
      // eslint-disable-next-line @next/next/no-location-assign-relative-destination
      window.location.assign("/sign-in");
    }
  }
  return (
    <div className="flex flex-col gap-3">
      {!asking ? (
        <Button tone="quiet" className="self-start" onClick={() => setAsking(true)}>
          Sign out everywhere…
        </Button>
      ) : (
        <>
          <p>
            Every tablet and computer signed in as you is signed out, this one too. Readings a tablet has not sent yet
            stay on it and go up at your next sign-in there.
          </p>
          <div className="flex flex-wrap gap-3">
            <Button tone="danger" disabled={busy} onClick={go}>
              {busy ? "Signing out…" : "Yes, sign me out everywhere"}
            </Button>
            <Button tone="quiet" disabled={busy} onClick={() => setAsking(false)}>
              Cancel
            </Button>
          </div>
        </>
      )}
      {error && (
        <p role="alert" className="text-sm font-medium text-fail">
          {error}
        </p>
      )}
    </div>
  );
}
