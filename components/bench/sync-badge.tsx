"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { useOnline } from "@/hooks/use-online";
import { getSyncStatus, IDLE_STATUS } from "@/lib/offline/meta";
import { connectionOf, CONNECTION_WORDS, waitingWords } from "@/lib/offline/sync-state";
import { useDexieQuery } from "@/hooks/use-dexie-query";
import { useBench } from "./bench-context";
import { SyncMark } from "./sync-mark";

// The sync badge: what waits to be sent (readings and photos), whether the server is reachable
// (from the sync engine's last run, not only the device's network), when it last took them, and
// what went wrong, in words. Colour is never alone: each state has its own word and mark. Its
// size never changes (the pill is one width, the words keep their lines), so nothing below it
// moves under a finger when readings queue or an error shows.
const time = (iso?: string) =>
  iso ? new Date(iso).toLocaleTimeString([], { hour: "2-digit", minute: "2-digit" }) : undefined;

// On a phone the words take their own row under the pill and the button; wider, one row.
const LAYOUT = [
  "grid grid-cols-[auto_minmax(0,1fr)] items-center gap-x-4 gap-y-1 [grid-template-areas:'pill_send'_'info_info']",
  "sm:grid-cols-[auto_minmax(0,1fr)_auto] sm:[grid-template-areas:'pill_info_send']",
].join(" ");
const PILL = "inline-flex min-h-11 w-40 items-center gap-2 rounded-full border-2 px-4 font-semibold [grid-area:pill]";

const TONE_CLASS = {
  ok: "border-pass bg-pass-soft text-pass",
  wait: "border-watch bg-watch-soft text-watch",
  bad: "border-fail bg-fail-soft text-fail",
} as const;

export function SyncBadge() {
  const { db, engine, actor } = useBench();
  const online = useOnline();
  const [tapped, setTapped] = useState(false);
  // One read for the whole badge (it re-runs after each commit on these tables).
  const [{ pending, photos, others, refused, status }] = useDexieQuery(
    db,
    ["outbox", "readings", "photos", "meta"],
    () =>
      db.transaction("r", [db.outbox, db.readings, db.photos, db.meta], async () => {
        const [mine, all, rejected, waitingPhotos, st] = await Promise.all([
          db.outbox.where("takenBy").equals(actor.userId).count(),
          db.outbox.count(),
          db.readings.where("state").equals("rejected").count(),
          db.photos.where("state").equals("pending").toArray(),
          getSyncStatus(db),
        ]);
        const myPhotos = waitingPhotos.filter((p) => p.takenBy === actor.userId).length;
        const othersWaiting = all - mine + waitingPhotos.length - myPhotos;
        return { pending: mine, photos: myPhotos, others: othersWaiting, refused: rejected, status: st };
      }),
    [actor.userId],
    { pending: 0, photos: 0, others: 0, refused: 0, status: IDLE_STATUS },
  );
  const waiting = pending + photos;
  const connection = connectionOf(online, status);
  const tone = status.lastError && (status.needsAction || waiting > 0) ? "bad" : waiting > 0 ? "wait" : "ok";
  const head = status.running ? "Sending…" : waiting > 0 ? `${waiting} to send` : "All sent";
  const nextTry = status.nextAttemptAt && !status.needsAction ? ` (next try ${time(status.nextAttemptAt)})` : "";
  const problems = [
    waitingWords(pending, photos),
    status.lastError ? `${status.lastError}${nextTry}` : "",
    refused > 0 ? `${refused} refused by the server: open the job to fix` : "",
    others > 0 ? `${others} by another person wait for their sign-in` : "",
  ].filter(Boolean);
  const signIn = status.needsAction && status.lastError?.startsWith("Signed out");

  async function sendNow() {
    setTapped(true);
    await engine.sync("manual").finally(() => setTapped(false));
  }

  return (
    <div
      className={LAYOUT}
      data-testid="sync-badge"
      data-pending={pending}
      data-photos={photos}
      data-refused={refused}
      data-connection={connection}
      role="status"
      aria-live="polite"
    >
      <span className={`${PILL} ${TONE_CLASS[tone]}`}>
        <SyncMark tone={tone} />
        <span className="truncate">{head}</span>
      </span>
      <div className="flex min-w-0 flex-col text-sm leading-5 [grid-area:info]">
        <span className="truncate text-muted" data-testid="sync-connection">
          {CONNECTION_WORDS[connection]}
          {status.lastSuccessAt ? ` · last sent ${time(status.lastSuccessAt)}` : " · nothing sent yet"}
        </span>
        {/* Two lines kept for the rest, filled or not, so the bar's height never changes. */}
        <span className={`line-clamp-2 h-10 ${tone === "bad" ? "font-medium text-fail" : "text-muted"}`}>
          {problems.join(" · ")}
          {signIn && (
            <>
              {" "}
              <a className="font-semibold text-steel underline" href={`/sign-in?next=${encodeURIComponent("/bench")}`}>
                Sign in again
              </a>
            </>
          )}
        </span>
      </div>
      <Button tone="quiet" big onClick={sendNow} disabled={tapped || !online} className="[grid-area:send]">
        Send now
      </Button>
    </div>
  );
}
