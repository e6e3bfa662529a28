"use client";

import { useEffect, useState } from "react";
import { Notice } from "@/components/ui/notice";
import type { SignOutNotice, WaitingPerson } from "@/lib/offline/sign-out";

// Beside the sign-in form on a shared tablet: who just signed out, and whose readings still wait
// here. They go out only under their own person's next session. Also tells the server about a
// sign-out made offline, as soon as this screen loads with a network or the network comes back.
type Seen = { notice: SignOutNotice | null; people: WaitingPerson[] };

const count = (n: number, one: string) => `${n} ${one}${n === 1 ? "" : "s"}`;

function what(p: { readings: number; photos: number; studies?: number }): string {
  const parts = [
    p.readings ? count(p.readings, "reading") : "",
    p.photos ? count(p.photos, "photo") : "",
    // A notice kept by a version before studies has none.
    p.studies ? `${p.studies} gauge ${p.studies === 1 ? "study" : "studies"} in progress` : "",
  ].filter(Boolean);
  return parts.length > 1 ? `${parts.slice(0, -1).join(", ")} and ${parts.at(-1)}` : (parts[0] ?? "");
}

async function reportNow(): Promise<void> {
  const [{ getBenchDb }, { reportEndedSessions }] = await Promise.all([
    import("@/lib/offline/db"),
    import("@/lib/offline/sign-out"),
  ]);
  await reportEndedSessions(getBenchDb());
}

async function look(): Promise<Seen> {
  const [{ getBenchDb }, off, { getMeta }] = await Promise.all([
    import("@/lib/offline/db"),
    import("@/lib/offline/sign-out"),
    import("@/lib/offline/meta"),
  ]);
  const db = getBenchDb();
  const [notice, people] = await Promise.all([getMeta<SignOutNotice>(db, off.NOTICE), off.waitingByPerson(db)]);
  return { notice: notice ?? null, people };
}

export function WaitingOnTablet() {
  const [seen, setSeen] = useState<Seen | null>(null);
  useEffect(() => {
    let live = true;
    // No storage (private mode): nothing can wait here.
    look().then(
      (s) => live && setSeen(s),
      () => undefined,
    );
    const report = () => void reportNow().catch(() => undefined); // kept for the next try
    report();
    window.addEventListener("online", report);
    return () => {
      live = false;
      window.removeEventListener("online", report);
    };
  }, []);
  if (!seen) return null;
  const { notice, people } = seen;
  return (
    <>
      {notice && (
        <div data-testid="signed-out-notice" data-waiting={notice.readings}>
          <Notice title={`${notice.name} signed out; the bench is locked`}>
            {notice.readings + notice.photos + (notice.studies ?? 0) > 0
              ? `${what(notice)} by ${notice.name} wait on this tablet. ` +
                `They wait for ${notice.name}'s next sign-in here, and are never sent or shown under anyone else's.`
              : `Nothing of ${notice.name}'s was waiting to be sent.`}
          </Notice>
        </div>
      )}
      {people.length > 0 && (
        <section aria-labelledby="waiting-here" className="flex flex-col gap-1 text-sm" data-testid="waiting-here">
          <h2 id="waiting-here" className="font-semibold">
            Waiting on this tablet
          </h2>
          <ul className="flex flex-col gap-1">
            {people.map((p) => (
              <li key={p.userId} data-user={p.userId} data-readings={p.readings}>
                {p.name}: {what(p)}, waiting for them to sign in here
              </li>
            ))}
          </ul>
        </section>
      )}
    </>
  );
}
