import "server-only";
import { getSequelize } from "@/lib/server/core/db";
import { retriedTransaction, withConflictRetry } from "@/lib/server/core/cluster";
import { env } from "@/lib/server/core/env";
import { enqueueReleaseMail } from "@/lib/server/mail/outbox";
import { enqueueMail, queuedWithPrefix } from "@/lib/server/mail/repo";
import { deliverPendingMail, type DeliveryReport } from "@/lib/server/mail/outbox-worker";
import { digestMessage, readyMessage } from "@/lib/server/notify/messages";
import {
  changedOpenJobs,
  flagsSince,
  pastDigests,
  openJobsAfter,
  recipients,
  releaseCount,
  releasesWithoutMail,
  shopName,
  shopsWithFlagsSince,
  type FeedCursors,
  type OpenJob,
} from "@/lib/server/notify/repo";
import { releaseChecklist } from "@/lib/server/release/checklist";

// The background notifier (started by instrumentation.ts; tests call runNotifierOnce directly).
// Each run: queue a digest of new flags to each shop's leads, and "ready for release" to the
// inspectors of each job whose checklist turned complete (once per job, spec revision and release
// round); then deliver what is due. Signing queues the build record itself; the run only catches
// a release that has none (its customer had no e-mail address at signing, or the release row was
// written outside signRelease). Every step is keyed so two app instances running it at once queue
// each message only once.
const DAY = 86_400_000;
// Jobs checked each pass besides those that changed: a slow round over every open job, so a
// change the feed does not show (a gauge's dates corrected) is still noticed.
const ROUND_ROBIN_PER_PASS = 20;

// Checklists are computed for at most this long per pass; the rest wait for the next pass.
const CHECK_BUDGET_MS = 10_000;

type PassState = { feed: FeedCursors | null; lastPassAt: Date | null; robin: number; backlog: OpenJob[] };
const memory = globalThis as unknown as { __tenthwiseNotifierState?: PassState };

export type NotifierReport = {
  releaseMails: number;
  digests: number;
  ready: number;
  delivered: DeliveryReport;
  errors: string[];
};

async function catchUpReleases(now: Date): Promise<number> {
  let n = 0;
  for (const r of await releasesWithoutMail(new Date(now.getTime() - 14 * DAY))) {
    if (await retriedTransaction((t) => enqueueReleaseMail(t, { shopId: r.shopId, jobId: r.jobId, releaseId: r.id })))
      n += 1;
  }
  return n;
}

// A digest lists the flags raised since the last one that no digest listed yet, so a flag whose row
// commits late (on a cluster, one with a lower id from another node) is still told once. Each digest
// is the next round of its shop; two notifiers that read the same last round queue the same keys, so
// only one of them queues (one database: the unique key; a cluster: the later commit fails its
// certification and the run starts over, reading the round the other queued). The window reaches an
// hour before the last digest, far beyond the moment a flag's row waits to reach every node.
const DIGEST_OVERLAP_MS = 3_600_000;

async function digestFor(shopId: number, now: Date): Promise<number> {
  const [last] = await pastDigests(shopId);
  const since = last ? new Date(last.at.getTime() - DIGEST_OVERLAP_MS) : new Date(now.getTime() - DAY);
  const told = last ? (await pastDigests(shopId, new Date(since.getTime() - DAY))).flatMap((d) => d.flagIds) : [];
  const flags = await flagsSince(shopId, since, told);
  if (flags.length === 0) return 0;
  const leads = await recipients(shopId, "lead");
  const round = (last?.round ?? 0) + 1;
  const { subject, text } = digestMessage(await shopName(shopId), flags, last?.at ?? null);
  const payload = { text, round, maxFlagId: Math.max(...flags.map((f) => f.id)), flagIds: flags.map((f) => f.id) };
  // All the leads' copies in one transaction: a round is queued whole or not at all.
  return getSequelize().transaction(async (t) => {
    let n = 0;
    for (const lead of leads) {
      const mail = { shopId, kind: "flag_digest" as const, to: lead.email, subject, payload };
      if (await enqueueMail(t, { ...mail, dedupeKey: `flag_digest:${shopId}:round${round}:${lead.id}` })) n += 1;
    }
    return n;
  });
}

async function readyFor(job: OpenJob): Promise<number> {
  const round = `ready:${job.id}:rev${job.specRevision}:rel${await releaseCount(job.id)}:`;
  if (await queuedWithPrefix(round)) return 0; // already told the inspectors this round
  const checklist = await releaseChecklist(job.shopId, job.id);
  if (!checklist.complete) return 0;
  const { subject, text } = readyMessage(job, checklist);
  let n = 0;
  for (const inspector of await recipients(job.shopId, "inspector")) {
    if (
      await enqueueMail(null, {
        shopId: job.shopId,
        kind: "ready_for_release",
        to: inspector.email,
        subject,
        payload: { text, jobId: job.id },
        dedupeKey: `${round}${inspector.id}`,
      })
    )
      n += 1;
  }
  return n;
}

const passState = () => (memory.__tenthwiseNotifierState ??= { feed: null, lastPassAt: null, robin: 0, backlog: [] });

/**
 * Open jobs whose checklist may have turned complete: just changed first, then last pass's
 * leftovers, then the round.
 */
async function jobsToCheck(startedAt: Date): Promise<OpenJob[]> {
  const st = passState();
  // A few seconds of overlap: a change committed while the last pass ran is not missed.
  const at = new Date((st.lastPassAt ?? new Date(startedAt.getTime() - DAY)).getTime() - 5000);
  const changed = await changedOpenJobs({ feed: st.feed ?? null, at });
  const round = await openJobsAfter(st.robin, ROUND_ROBIN_PER_PASS);
  Object.assign(st, { feed: changed.feed, lastPassAt: startedAt, robin: round.at(-1)?.id ?? 0 });
  const byId = new Map([...changed.jobs, ...st.backlog, ...round].map((j) => [j.id, j]));
  return [...byId.values()];
}

async function readyPass(
  now: Date,
  step: <T>(what: string, fn: () => Promise<T>, fallback: T) => Promise<T>,
): Promise<number> {
  const queue = await step("ready for release", () => jobsToCheck(now), [] as OpenJob[]);
  const until = Date.now() + CHECK_BUDGET_MS;
  let ready = 0;
  let i = 0;
  for (; i < queue.length && Date.now() < until; i++)
    ready += await step(`ready for release ${queue[i].code}`, () => readyFor(queue[i]), 0);
  passState().backlog = queue.slice(i, i + 2000);
  return ready;
}

/** One pass of the notifier. A failing step is reported and does not stop the others. */
export async function runNotifierOnce(opts: { now?: Date } = {}): Promise<NotifierReport> {
  const now = opts.now ?? new Date();
  const errors: string[] = [];
  const step = async <T>(what: string, fn: () => Promise<T>, fallback: T): Promise<T> => {
    try {
      return await fn();
    } catch (err) {
      errors.push(`${what}: ${err instanceof Error ? err.message : String(err)}`);
      return fallback;
    }
  };
  const releaseMails = await step("release mail", () => catchUpReleases(now), 0);
  let digests = 0;
  for (const shopId of await step(
    "flag digest",
    () => shopsWithFlagsSince(new Date(now.getTime() - 7 * DAY)),
    [] as number[],
  )) {
    digests += await step(`flag digest for shop ${shopId}`, () => withConflictRetry(() => digestFor(shopId, now)), 0);
  }
  const ready = await readyPass(now, step);
  // Delivery's clock is read after queuing, so what this run queued is already due.
  const delivered = await step("delivery", () => deliverPendingMail({ now: opts.now ?? new Date() }), {
    sent: [],
    failed: [],
  });
  return { releaseMails, digests, ready, delivered, errors };
}

const holder = globalThis as unknown as { __tenthwiseNotifier?: { timer: NodeJS.Timeout; first: NodeJS.Timeout } };

/** Starts the timer once per process; NOTIFY_INTERVAL_SECONDS=0 leaves it off. */
export function startNotifier(): boolean {
  const seconds = env().NOTIFY_INTERVAL_SECONDS;
  if (holder.__tenthwiseNotifier || seconds === 0) return false;
  let running = false;
  const tick = async () => {
    if (running) return; // a slow run (many PDFs) is never overlapped by the next
    running = true;
    try {
      const report = await runNotifierOnce();
      for (const e of report.errors) console.error(`[tenthwise] notifier: ${e}`);
    } catch (err) {
      console.error("[tenthwise] notifier run failed", err);
    } finally {
      running = false;
    }
  };
  const timer = setInterval(tick, seconds * 1000);
  timer.unref();
  const first = setTimeout(tick, Math.min(15, seconds) * 1000);
  first.unref();
  holder.__tenthwiseNotifier = { timer, first };
  return true;
}

/** Stops the timer (tests, and a clean shutdown). */
export function stopNotifier(): void {
  const n = holder.__tenthwiseNotifier;
  if (!n) return;
  clearInterval(n.timer);
  clearTimeout(n.first);
  holder.__tenthwiseNotifier = undefined;
}

export const notifierRunning = () => !!holder.__tenthwiseNotifier;
