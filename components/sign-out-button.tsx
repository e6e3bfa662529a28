"use client";

import { Button } from "@/components/ui/button";

export function SignOutButton() {
  async function signOut() {
    await fetch("/api/session", { method: "DELETE", credentials: "same-origin" }).catch(() => undefined);
    window.location.assign("/sign-in");
  }
  return (
    <Button tone="quiet" onClick={signOut}>
      Sign out
    </Button>
  );
}
