// A simulated bench tablet: the real offline code (lib/offline) on an in-memory IndexedDB. Each
// reading is saved and queued the way the entry screen does (recordReading), and the real sync
// engine sends the outbox, so resends carry the same ids and follow the same backoff and refusal
// rules as on a shop tablet. Only the backoff's scale is shorter, so a soak finishes in minutes.
import "fake-indexeddb/auto";
import { BenchDb, type LocalReading } from "@/lib/offline/db";
import { getSyncStatus, setMeta, type DeviceActor } from "@/lib/offline/meta";
import { recordReading, type NewReading } from "@/lib/offline/readings";
import { SyncEngine } from "@/lib/offline/sync-engine";
import { toPushReading } from "@/lib/offline/wire";
import type { PushReadingInput } from "@/lib/schemas/sync";

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

type MeReply = { shop: { id: number } };

export interface Session {
  cookie: string;
  actor: DeviceActor;
}

/** Signs in through `base` as the browser's sign-in page does (its own Origin), returning the cookie. */
export async function signIn(base: string, origin: string, email: string, password: string): Promise<Session> {
  for (let attempt = 1; ; attempt++) {
    const res = await fetch(`${base}/api/session`, {
      method: "POST",
      headers: { "content-type": "application/json", origin },
      body: JSON.stringify({ email, password }),
    }).catch((err: Error) => err);
    if (!(res instanceof Error) && res.ok) {
      const body = (await res.json()) as { user: { id: number; name: string; role: DeviceActor["role"] } };
      const cookie = (res.headers.get("set-cookie") ?? "").split(";")[0];
      const me = (await fetch(`${base}/api/me`, { headers: { cookie } }).then((r) => r.json())) as MeReply;
      const actor = { userId: body.user.id, shopId: me.shop.id, name: body.user.name, email, role: body.user.role };
      return { cookie, actor };
    }
    const why = res instanceof Error ? res.message : `${res.status} ${await res.text()}`;
    if (attempt >= 5) throw new Error(`Sign-in as ${email} failed: ${why}`);
    await sleep(1000 * attempt);
  }
}

export interface TabletOptions {
  name: string;
  base: string;
  origin: string;
  session: Session;
  plan: NewReading[];
  /** Readings entered per burst, and the pause between bursts (the machinist's pace). */
  burst: number;
  pauseMs: number;
  random: () => number;
  /** Told four times a second how many readings the tablet holds as synced. */
  onProgress?: (synced: number) => void;
  deadlineMs: number;
}

export interface TabletResult {
  name: string;
  readings: LocalReading[];
  payloads: PushReadingInput[];
  pushes: number;
  ms: number;
}

/** Enters the plan at the machinist's pace while the engine syncs; resolves once the outbox is empty. */
export async function runTablet(o: TabletOptions): Promise<TabletResult> {
  const db = new BenchDb(`soak-${o.name}-${Date.now()}`);
  await setMeta(db, "actor", o.session.actor);
  let pushes = 0;
  const fetchWithSession: typeof fetch = async (input, init) => {
    // The browser adds these itself: the session cookie and, on a POST, the page's origin.
    const headers = new Headers(init?.headers);
    headers.set("cookie", o.session.cookie);
    if ((init?.method ?? "GET") !== "GET") headers.set("origin", o.origin);
    const { credentials: _c, ...rest } = init ?? {};
    if (String(input).endsWith("/api/sync") && init?.method === "POST") pushes++;
    return fetch(input, { ...rest, headers });
  };
  const report = setInterval(
    () =>
      void db.readings
        .where("state")
        .equals("synced")
        .count()
        .then((n) => o.onProgress?.(n))
        .catch(() => undefined),
    250,
  );
  const engine = new SyncEngine({
    db,
    fetch: fetchWithSession,
    baseUrl: o.base,
    intervalMs: 2_000,
    entryDebounceMs: 100,
    backoff: { baseMs: 250, maxMs: 4_000 },
    random: o.random,
  });
  const t0 = performance.now();
  engine.start();
  try {
    const ctx = { deviceId: `soak-${o.name}`, takenBy: o.session.actor.userId };
    for (let i = 0; i < o.plan.length; i += o.burst) {
      for (const r of o.plan.slice(i, i + o.burst)) await recordReading(db, r, ctx);
      engine.afterEntry();
      await sleep(o.pauseMs);
    }
    const until = Date.now() + o.deadlineMs;
    while ((await db.outbox.count()) > 0 || (await getSyncStatus(db)).running) {
      if (Date.now() > until) {
        const s = await getSyncStatus(db);
        throw new Error(`${o.name}: ${await db.outbox.count()} readings still queued at the deadline (${s.lastError})`);
      }
      await sleep(200);
    }
  } finally {
    engine.stop();
    clearInterval(report);
  }
  // The database stays open (in memory, gone with the process): a sync the engine's timer started
  // just before stop() may still be finishing its run in it.
  const readings = await db.readings.toArray();
  return { name: o.name, readings, payloads: readings.map(toPushReading), pushes, ms: performance.now() - t0 };
}
