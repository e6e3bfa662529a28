"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { api, ApiError } from "@/lib/client/api";

// Puts an unsent message back at the front of the queue; the notifier sends it on its next run.
export function RetryButton({ id }: { id: number }) {
  const router = useRouter();
  const [state, setState] = useState<"idle" | "busy" | "queued">("idle");
  const [error, setError] = useState<string | null>(null);
  async function retry() {
    setState("busy");
    setError(null);
    try {
      await api(`/api/mail/outbox/${id}/retry`, { method: "POST" });
      setState("queued");
      router.refresh();
    } catch (err) {
      setState("idle");
      setError(err instanceof ApiError ? err.message : "Could not reach the server; try again");
    }
  }
  return (
    <span className="inline-flex flex-col items-start gap-1">
      <Button tone="quiet" onClick={retry} disabled={state !== "idle"}>
        {state === "queued" ? "Queued: sends on the next run" : state === "busy" ? "Queuing…" : "Try again now"}
      </Button>
      {error && (
        <span role="alert" className="text-sm text-fail">
          {error}
        </span>
      )}
    </span>
  );
}
