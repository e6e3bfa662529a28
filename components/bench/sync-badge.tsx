"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { useOnline } from "@/hooks/use-online";
import { getSyncStatus, IDLE_STATUS } from "@/lib/offline/meta";
import { useDexieQuery } from "@/hooks/use-dexie-query";
import { useBench } from "./bench-context";

// The sync badge: how many readings wait, when the server last took them, and
// what went wrong, in words. Colour is never alone: each state has its own word and mark.
const time = (iso?: string) =>
  iso ? new Date(iso).toLocaleTimeString([], { hour: "2-digit", minute: "2-digit" }) : undefined;

function Mark({ tone }: { tone: "ok" | "wait" | "bad" }) {
  if (tone === "ok")
    return (
      <svg width="18" height="18" viewBox="0 0 18 18" aria-hidden="true">
        <path d="M3 9.5 7.2 13.5 15 4.5" fill="none" stroke="currentColor" strokeWidth="3" strokeLinecap="round" />
      </svg>
    );
  if (tone === "wait")
    return (
      <svg width="18" height="18" viewBox="0 0 18 18" aria-hidden="true">
        <circle cx="9" cy="9" r="7" fill="none" stroke="currentColor" strokeWidth="2.5" />
        <path d="M9 5v4.5l3 2" fill="none" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" />
      </svg>
    );
  return (
    <svg width="18" height="18" viewBox="0 0 18 18" aria-hidden="true">
      <path d="M9 1.5 17 16H1Z" fill="currentColor" />
      <path d="M9 6.5v4.5M9 13.3v.2" stroke="white" strokeWidth="2.2" strokeLinecap="round" />
    </svg>
  );
}

export function SyncBadge() {
  const { db, engine, actor } = useBench();
  const online = useOnline();
  const [tapped, setTapped] = useState(false);
  // One read for the whole badge (it re-runs after each commit on these tables).
  const [{ pending, others, refused, status }] = useDexieQuery(
    db,
    ["outbox", "readings", "meta"],
    () =>
      db.transaction("r", db.outbox, db.readings, db.meta, async () => {
        const [mine, all, rejected, st] = await Promise.all([
          db.outbox.where("takenBy").equals(actor.userId).count(),
          db.outbox.count(),
          db.readings.where("state").equals("rejected").count(),
          getSyncStatus(db),
        ]);
        return { pending: mine, others: all - mine, refused: rejected, status: st };
      }),
    [actor.userId],
    { pending: 0, others: 0, refused: 0, status: IDLE_STATUS },
  );
  const tone = status.lastError && (status.needsAction || pending > 0) ? "bad" : pending > 0 ? "wait" : "ok";
  const toneClass =
    tone === "ok"
      ? "border-pass bg-pass-soft text-pass"
      : tone === "wait"
        ? "border-watch bg-watch-soft text-watch"
        : "border-fail bg-fail-soft text-fail";
  const head = status.running ? "Sending…" : pending > 0 ? `${pending} waiting to send` : "All sent";

  async function sendNow() {
    setTapped(true);
    await engine.sync("manual").finally(() => setTapped(false));
  }

  return (
    <div
      className="flex flex-wrap items-center gap-x-4 gap-y-1"
      data-testid="sync-badge"
      data-pending={pending}
      data-refused={refused}
      role="status"
      aria-live="polite"
    >
      <span className={`inline-flex min-h-11 items-center gap-2 rounded-full border-2 px-4 font-semibold ${toneClass}`}>
        <Mark tone={tone} />
        {head}
      </span>
      <span className="text-sm text-muted">
        {online ? "Online" : "Offline · kept on this tablet"}
        {status.lastSuccessAt ? ` · last sent ${time(status.lastSuccessAt)}` : " · nothing sent yet"}
      </span>
      {status.lastError && (
        <span className="text-sm font-medium text-fail">
          {status.lastError}
          {status.nextAttemptAt && !status.needsAction ? ` (next try ${time(status.nextAttemptAt)})` : ""}
        </span>
      )}
      {status.needsAction && status.lastError?.startsWith("Signed out") && (
        <a className="font-semibold text-steel underline" href={`/sign-in?next=${encodeURIComponent("/bench")}`}>
          Sign in again
        </a>
      )}
      {refused > 0 && (
        <span className="text-sm font-semibold text-fail">{refused} refused by the server: open the job to fix</span>
      )}
      {others > 0 && <span className="text-sm text-muted">{others} by another person wait for their sign-in</span>}
      <Button tone="quiet" big onClick={sendNow} disabled={tapped || !online} className="ml-auto">
        Send now
      </Button>
    </div>
  );
}
