// Signing out on a shared tablet. The lock is local and immediate: the remembered person is
// forgotten, so the bench (a cached shell) opens only behind the sign-in screen, with or without a
// network. Their unsent readings and photos stay, keyed by who took them, and only their own next
// session sends them (the outbox is read per person). The server session is ended as soon as the
// server answers; until then its id is kept here and a session with that id is never used again.
import type { BenchDb } from "./db";
import { getMeta, setMeta, type DeviceActor } from "./meta";
import type { Fetch } from "./transport";

/** What the lock screen says after a sign-out on this tablet. */
export interface SignOutNotice {
  name: string;
  readings: number;
  photos: number;
  /** Gauge studies in progress (lib/offline/study-drafts.ts), kept for their person's next sign-in. */
  studies: number;
  at: string;
}

/** Someone with work still on this tablet. */
export interface WaitingPerson {
  userId: number;
  name: string;
  readings: number;
  photos: number;
  studies: number;
}

const ENDED = "endedSessions";
const PEOPLE = "people";
export const NOTICE = "signOutNotice";

/** Remembers who signed in here (their name, for the lock screen's list of waiting work). */
export async function rememberActor(db: BenchDb, actor: DeviceActor): Promise<void> {
  await db.transaction("rw", db.meta, async () => {
    const people = (await getMeta<Record<string, string>>(db, PEOPLE)) ?? {};
    await setMeta(db, PEOPLE, { ...people, [actor.userId]: actor.name });
    await setMeta(db, "actor", actor);
    await db.meta.delete(NOTICE);
  });
}

/** Locks the tablet for the person signed in now; null when nobody was. Never needs the network. */
export async function lockDevice(db: BenchDb, now = new Date()): Promise<SignOutNotice | null> {
  return db.transaction("rw", [db.meta, db.outbox, db.photos, db.studyDrafts], async () => {
    const actor = await getMeta<DeviceActor>(db, "actor");
    await db.meta.delete("actor");
    if (!actor) return null;
    if (actor.sessionId) await setMeta(db, ENDED, [...(await endedSessions(db)), actor.sessionId]);
    const readings = await db.outbox.where("takenBy").equals(actor.userId).count();
    const photos = await db.photos.filter((p) => p.state === "pending" && p.takenBy === actor.userId).count();
    const studies = await db.studyDrafts.where("userId").equals(actor.userId).count();
    const notice = { name: actor.name, readings, photos, studies, at: now.toISOString() };
    await setMeta(db, NOTICE, notice);
    return notice;
  });
}

/** Sessions signed out on this tablet that the server may not know ended yet. */
export async function endedSessions(db: BenchDb): Promise<string[]> {
  return (await getMeta<string[]>(db, ENDED)) ?? [];
}

/**
 * Tells the server about every session signed out here; each one it answered for is forgotten.
 * Answers whether none is left to tell (false: no connection, try again on the next page).
 */
export async function reportEndedSessions(db: BenchDb, fetchFn: Fetch = fetch, timeoutMs = 4000): Promise<boolean> {
  for (const sessionId of await endedSessions(db)) {
    const ctl = new AbortController();
    const timer = setTimeout(() => ctl.abort(), timeoutMs);
    try {
      const res = await fetchFn("/api/session", {
        method: "DELETE",
        headers: { "Content-Type": "application/json" },
        body: JSON.stringify({ sessionId }),
        credentials: "same-origin",
        signal: ctl.signal,
      });
      if (res.status >= 500) return false;
    } catch {
      return false;
    } finally {
      clearTimeout(timer);
    }
    await db.transaction("rw", db.meta, async () => {
      await setMeta(
        db,
        ENDED,
        (await endedSessions(db)).filter((id) => id !== sessionId),
      );
    });
  }
  return true;
}

/** Everyone whose readings, photos or gauge studies still wait on this tablet, most waiting first. */
export async function waitingByPerson(db: BenchDb): Promise<WaitingPerson[]> {
  return db.transaction("r", [db.meta, db.outbox, db.photos, db.studyDrafts], async () => {
    const names = (await getMeta<Record<string, string>>(db, PEOPLE)) ?? {};
    const people = new Map<number, WaitingPerson>();
    const person = (userId: number) => {
      const known = people.get(userId) ?? {
        userId,
        name: names[userId] ?? "Someone",
        readings: 0,
        photos: 0,
        studies: 0,
      };
      people.set(userId, known);
      return known;
    };
    await db.outbox.each((row) => void person(row.takenBy).readings++);
    await db.photos.filter((p) => p.state === "pending").each((p) => void person(p.takenBy).photos++);
    await db.studyDrafts.each((s) => void person(s.userId).studies++);
    const waiting = (p: WaitingPerson) => p.readings + p.photos + p.studies;
    return [...people.values()].sort((a, b) => waiting(b) - waiting(a));
  });
}

/**
 * The sign-out button: locks the tablet at once, then ends the browser's session on the server
 * (and any earlier one signed out here) if it answers within a moment; if not, the next page does.
 */
export async function signOutHere(db: BenchDb, fetchFn: Fetch = fetch, timeoutMs = 3000): Promise<void> {
  // Storage refused (private mode) must not keep the server session alive: the request still goes.
  const locked = await lockDevice(db).then(
    () => true,
    () => false,
  );
  const ctl = new AbortController();
  const timer = setTimeout(() => ctl.abort(), timeoutMs);
  try {
    await fetchFn("/api/session", { method: "DELETE", credentials: "same-origin", signal: ctl.signal });
  } catch {
    return; // no server: the session ids kept above are reported later
  } finally {
    clearTimeout(timer);
  }
  if (locked) await reportEndedSessions(db, fetchFn, timeoutMs);
}
