"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";

// Signing out never waits for the server: the tablet locks first (lib/offline/sign-out.ts), so a
// shared tablet with no network still ends up behind the sign-in screen.
export function SignOutButton() {
  const [busy, setBusy] = useState(false);
  async function signOut() {
    setBusy(true);
    try {
      const [{ getBenchDb }, { signOutHere }] = await Promise.all([
        import("@/lib/offline/db"),
        import("@/lib/offline/sign-out"),
      ]);
      await signOutHere(getBenchDb());
    } finally {
      // Whatever failed above, the screen leaves: the sign-in page (or, offline, the locked bench).
      window.location.assign("/sign-in");
    }
  }
  return (
    <Button tone="quiet" onClick={signOut} disabled={busy}>
      {busy ? "Signing out…" : "Sign out"}
    </Button>
  );
}
