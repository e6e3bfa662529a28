// The client sync engine: pushes the outbox, pulls what changed, uploads photos.
// Triggers: an entry (debounced), the `online` event, app start, a timer, the machinist's tap.
// One run at a time; a trigger during a run asks for one more run after it. Network errors, 5xx
// and 429 back off exponentially with jitter (never sooner than the server's Retry-After); an error
// that needs a person (signed out) is shown in words and retried only on the next trigger. A batch
// the server will never take (refusal.ts) is never resent as it was: the readings it names are
// marked refused and the others go at once. Entry never waits for any of this.
import type { BenchDb } from "./db";
import { backoffDelay, DEFAULT_BACKOFF, type BackoffRule } from "./backoff";
import { ensureDeviceId, getMeta, getSyncStatus, patchSyncStatus, type DeviceActor } from "./meta";
import { applyPushResults, BATCH_SIZE, markRefused, nextBatch } from "./outbox";
import { applyFeed, heldJobIds } from "./packs";
import { uploadPhotos } from "./photos";
import { errorsByReading, rejectionOf } from "./refusal";
import { ActionError, pullFeed, pushBatch, TransientError, type Fetch } from "./transport";

export type SyncReason = "entry" | "online" | "start" | "timer" | "manual";

export interface SyncEngineOptions {
  db: BenchDb;
  fetch?: Fetch;
  /** "" in the browser (same origin); a full origin in tests and scripts. */
  baseUrl?: string;
  intervalMs?: number;
  entryDebounceMs?: number;
  backoff?: BackoffRule;
  /** Readings per push (default BATCH_SIZE). */
  batchSize?: number;
  random?: () => number;
  now?: () => Date;
}

const MAX_PULL_PAGES = 50;

export class SyncEngine {
  private readonly db: BenchDb;
  private readonly fetchFn: Fetch;
  private readonly base: string;
  private readonly opts: Required<
    Pick<SyncEngineOptions, "intervalMs" | "entryDebounceMs" | "backoff" | "batchSize" | "random" | "now">
  >;
  private running: Promise<void> | null = null;
  private again = false;
  private retryTimer: ReturnType<typeof setTimeout> | undefined;
  private entryTimer: ReturnType<typeof setTimeout> | undefined;
  private interval: ReturnType<typeof setInterval> | undefined;
  private readonly onOnline = () => void this.sync("online");

  constructor(o: SyncEngineOptions) {
    this.db = o.db;
    this.fetchFn = o.fetch ?? ((...a) => fetch(...a));
    this.base = o.baseUrl ?? "";
    this.opts = {
      intervalMs: o.intervalMs ?? 60_000,
      entryDebounceMs: o.entryDebounceMs ?? 700,
      backoff: o.backoff ?? DEFAULT_BACKOFF,
      batchSize: o.batchSize ?? BATCH_SIZE,
      random: o.random ?? Math.random,
      now: o.now ?? (() => new Date()),
    };
  }

  start(): void {
    if (typeof window !== "undefined") window.addEventListener("online", this.onOnline);
    this.interval = setInterval(() => void this.sync("timer"), this.opts.intervalMs);
    void this.sync("start");
  }

  stop(): void {
    if (typeof window !== "undefined") window.removeEventListener("online", this.onOnline);
    clearInterval(this.interval);
    clearTimeout(this.retryTimer);
    clearTimeout(this.entryTimer);
  }

  /** Called after each entry: batches a burst of entries into one push. */
  afterEntry(): void {
    clearTimeout(this.entryTimer);
    this.entryTimer = setTimeout(() => void this.sync("entry"), this.opts.entryDebounceMs);
  }

  /** Runs a sync unless one is running (then one more follows it) or a backoff is waiting. */
  sync(reason: SyncReason): Promise<void> {
    if (this.running) {
      this.again = true;
      return this.running;
    }
    // Claimed synchronously, so two triggers in the same tick can never start two runs.
    this.running = this.loop(reason).finally(() => (this.running = null));
    return this.running;
  }

  private async loop(reason: SyncReason): Promise<void> {
    const status = await getSyncStatus(this.db);
    const urgent = reason === "online" || reason === "manual" || reason === "start";
    if (!urgent && status.nextAttemptAt && Date.parse(status.nextAttemptAt) > this.opts.now().getTime()) return;
    do {
      this.again = false;
      await this.runOnce();
    } while (this.again);
  }

  /** One full run; records the outcome in the sync status the badge shows. */
  async runOnce(): Promise<void> {
    clearTimeout(this.retryTimer);
    const startedAt = this.opts.now().toISOString();
    await patchSyncStatus(this.db, { running: true, lastAttemptAt: startedAt });
    try {
      const actor = await getMeta<DeviceActor>(this.db, "actor");
      if (!actor) throw new ActionError(401, "Sign in once while online so this tablet knows who is measuring");
      await this.pushAll(actor.userId);
      await this.pullAll();
      const photos = await uploadPhotos(this.db, this.fetchFn, this.base, actor.userId);
      await patchSyncStatus(this.db, {
        running: false,
        lastOutcome: "sent",
        lastSuccessAt: this.opts.now().toISOString(),
        failures: 0,
        nextAttemptAt: undefined,
        needsAction: false,
        lastError: photos.unavailable
          ? `${photos.waiting} photo(s) wait: the server does not take uploads yet`
          : undefined,
      });
    } catch (err) {
      await this.recordFailure(err);
    }
  }

  private async recordFailure(err: unknown): Promise<void> {
    if (err instanceof ActionError) {
      await patchSyncStatus(this.db, {
        running: false,
        lastOutcome: "refused",
        lastError: err.message,
        needsAction: true,
        nextAttemptAt: undefined,
      });
      return;
    }
    const failures = (await getSyncStatus(this.db)).failures + 1;
    // The server's Retry-After (a database restart, a throttle) is a floor under our own backoff.
    const serverWait = err instanceof TransientError ? (err.retryAfterMs ?? 0) : 0;
    const delay = Math.max(serverWait, backoffDelay(failures, this.opts.backoff, this.opts.random));
    const message =
      err instanceof TransientError ? err.message : `Sync stopped: ${err instanceof Error ? err.message : String(err)}`;
    await patchSyncStatus(this.db, {
      running: false,
      lastOutcome: err instanceof TransientError ? err.reach : "failed",
      failures,
      lastError: message,
      needsAction: false,
      nextAttemptAt: new Date(this.opts.now().getTime() + delay).toISOString(),
    });
    clearTimeout(this.retryTimer);
    this.retryTimer = setTimeout(() => void this.sync("timer"), delay);
  }

  private async pushAll(userId: number): Promise<void> {
    const deviceId = await ensureDeviceId(this.db);
    let size = this.opts.batchSize;
    // Readings still to send one at a time after a refusal that named none of them.
    let singles = 0;
    const refusedNow = new Set<string>();
    for (;;) {
      const batch = await nextBatch(this.db, userId, singles > 0 ? 1 : size, refusedNow);
      if (batch.readings.length === 0) return;
      if (singles > 0) singles--;
      const answer = await pushBatch(this.fetchFn, this.base, deviceId, batch.payload, userId);
      if (answer.kind === "too_large" && batch.readings.length > 1) {
        size = Math.max(1, Math.floor(batch.readings.length / 2));
        continue;
      }
      if (answer.kind !== "results") {
        const refusal =
          answer.kind === "too_large"
            ? { code: "payload_too_large", message: "This reading is too large for the server", fields: {} }
            : answer;
        const pinned = errorsByReading(refusal.fields, batch.readings.length);
        if (pinned.size === 0 && batch.readings.length > 1) {
          singles = batch.readings.length;
          continue;
        }
        const refused = batch.readings.flatMap((r, i) =>
          pinned.size === 0 || pinned.has(i)
            ? [{ id: r.id, rejection: rejectionOf(refusal.code, refusal.message, pinned.get(i)) }]
            : [],
        );
        await markRefused(this.db, refused, this.opts.now());
        refused.forEach((r) => refusedNow.add(r.id));
        continue;
      }
      const outcome = await applyPushResults(this.db, batch.readings, answer.results, this.opts.now());
      // Held readings are sent again without the refused ones; no progress at all means stop.
      if (outcome.accepted + outcome.rejected === 0)
        throw new ActionError(422, "The server held every reading without saying why; try Sync now");
      for (const r of answer.results) if (r.status === "rejected" && r.id) refusedNow.add(r.id);
    }
  }

  private async pullAll(): Promise<void> {
    const jobs = await heldJobIds(this.db);
    if (jobs.length === 0) return;
    for (let page = 0; page < MAX_PULL_PAGES; page++) {
      const since = (await getMeta<string>(this.db, "cursor")) ?? "0";
      const feed = await pullFeed(this.fetchFn, this.base, since, jobs);
      await applyFeed(this.db, feed, this.opts.now());
      if (!feed.more) return;
    }
  }
}
