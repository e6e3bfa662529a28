import "server-only";
import { randomUUID } from "node:crypto";
import { Op, UniqueConstraintError, type Transaction } from "sequelize";
import { Customer, Job, MailOutbox } from "@/models";
import type { JsonObject } from "@/lib/schemas/json";
import { getSequelize } from "@/lib/server/core/db";
import { env } from "@/lib/server/core/env";

// The mail outbox: a message is written in the same transaction as what causes it and sent later
// by the worker (mail-outbox-worker.ts), so a mail server that is down never blocks a release.
// A dedupe key makes an event queue its message once, however many app instances notice it.
export type MailKind = "build_record" | "flag_digest" | "ready_for_release";

export type NewMail = {
  shopId: number;
  kind: MailKind;
  to: string;
  subject: string;
  payload: JsonObject;
  dedupeKey?: string;
};

export type OutboxRow = {
  id: number;
  shopId: number;
  kind: MailKind;
  toAddress: string;
  subject: string;
  payload: JsonObject;
  dedupeKey: string | null;
  attempts: number;
  lastError: string | null;
  nextAttemptAt: Date;
  sentAt: Date | null;
  createdAt: Date;
};

function reshape(m: MailOutbox): OutboxRow {
  const payload = typeof m.payload === "string" ? (JSON.parse(m.payload) as JsonObject) : m.payload;
  return {
    id: m.id,
    shopId: m.shopId,
    kind: m.kind as MailKind,
    toAddress: m.toAddress,
    subject: m.subject,
    payload,
    dedupeKey: m.dedupeKey ?? null,
    attempts: m.attempts,
    lastError: m.lastError ?? null,
    nextAttemptAt: m.nextAttemptAt,
    sentAt: m.sentAt ?? null,
    createdAt: m.createdAt,
  };
}

/** Queues a message; false when its dedupe key was already queued (nothing is added then). */
export async function enqueueMail(t: Transaction | null, m: NewMail): Promise<boolean> {
  getSequelize();
  try {
    await MailOutbox.create(
      {
        shopId: m.shopId,
        kind: m.kind,
        toAddress: m.to,
        subject: m.subject.slice(0, 255),
        payload: m.payload,
        dedupeKey: m.dedupeKey ?? null,
        nextAttemptAt: new Date(),
      },
      { transaction: t ?? undefined },
    );
    return true;
  } catch (err) {
    if (err instanceof UniqueConstraintError) return false;
    throw err;
  }
}

// The dedupe key of a release's build-record mail, written once: the sign transaction queues
// under it, and the notifier's search for releases without their mail builds the same text in SQL.
const releaseKey = (id: string) => `build_record:release:${id}`;
export const releaseMailKey = (releaseId: number) => releaseKey(String(releaseId));

/** releaseMailKey over an SQL column of release ids: the key's text around the id, joined by CONCAT. */
export function releaseMailKeySql(idColumn: string, quote: (text: string) => string): string {
  const [before, after] = releaseKey("\u0000").split("\u0000");
  return `CONCAT(${quote(before)}, ${idColumn}, ${quote(after)})`;
}

/**
 * Queues the build record to the customer (the PDF and the link are made when it is sent), in
 * the sign transaction, so it is in the outbox the moment the release is. Returns false when the
 * customer has no e-mail address or the release was already queued; the notifier tries again
 * for a release whose customer gets an address later.
 */
export async function enqueueReleaseMail(
  t: Transaction | null,
  o: { shopId: number; jobId: number; releaseId: number },
): Promise<boolean> {
  return queueRecord(t, o, releaseMailKey(o.releaseId));
}

/** The shop sends the record again (a customer asked for a new link): a new message each time. */
export async function enqueueRecordResend(
  t: Transaction | null,
  o: { shopId: number; jobId: number; releaseId: number },
): Promise<boolean> {
  return queueRecord(t, o, `${releaseMailKey(o.releaseId)}:again:${randomUUID()}`);
}

async function queueRecord(
  t: Transaction | null,
  o: { shopId: number; jobId: number; releaseId: number },
  dedupeKey: string,
): Promise<boolean> {
  getSequelize();
  const job = await Job.findOne({ where: { id: o.jobId, shopId: o.shopId }, transaction: t ?? undefined });
  const customer = job
    ? await Customer.findOne({ where: { id: job.customerId, shopId: o.shopId }, transaction: t ?? undefined })
    : null;
  if (!job || !customer?.email) return false;
  return enqueueMail(t, {
    shopId: o.shopId,
    kind: "build_record",
    to: customer.email,
    dedupeKey,
    subject: `Build record ${job.code}: ${job.title}`,
    payload: { jobId: o.jobId, releaseId: o.releaseId },
  });
}

/** Whether any message with this dedupe key prefix was queued (e.g. one job's "ready" mails). */
export async function queuedWithPrefix(prefix: string): Promise<boolean> {
  getSequelize();
  return (await MailOutbox.count({ where: { dedupeKey: { [Op.startsWith]: prefix } } })) > 0;
}

/**
 * Claims due messages for this worker: each claim pushes next_attempt_at past a lease in one
 * conditional UPDATE, so two workers (or two app instances) never send the same message at once.
 */
export async function claimDue(now: Date, limit: number, only?: number[], leaseSeconds = 300): Promise<OutboxRow[]> {
  getSequelize();
  const due = await MailOutbox.findAll({
    where: {
      sentAt: null,
      nextAttemptAt: { [Op.lte]: now },
      attempts: { [Op.lt]: env().MAIL_MAX_ATTEMPTS },
      ...(only ? { id: only } : {}),
    },
    order: [
      ["nextAttemptAt", "ASC"],
      ["id", "ASC"],
    ],
    limit,
  });
  const lease = new Date(now.getTime() + leaseSeconds * 1000);
  const claimed: OutboxRow[] = [];
  for (const m of due) {
    const [n] = await MailOutbox.update(
      { nextAttemptAt: lease },
      { where: { id: m.id, sentAt: null, nextAttemptAt: { [Op.lte]: now } } },
    );
    if (n === 1) claimed.push(reshape(m));
  }
  return claimed;
}

export async function markSent(id: number, at: Date): Promise<void> {
  await MailOutbox.update({ sentAt: at, lastError: null }, { where: { id } });
}

export async function markFailed(id: number, attempts: number, error: string, nextAttemptAt: Date): Promise<void> {
  await MailOutbox.update({ attempts, lastError: error.slice(0, 2000), nextAttemptAt }, { where: { id } });
}

/** The shop's latest messages, newest first, for the admin mail page. */
export async function listOutbox(shopId: number, limit = 100): Promise<OutboxRow[]> {
  getSequelize();
  const rows = await MailOutbox.findAll({ where: { shopId }, order: [["id", "DESC"]], limit });
  return rows.map(reshape);
}

export async function findOutboxRow(id: number): Promise<OutboxRow | null> {
  getSequelize();
  const row = await MailOutbox.findByPk(id);
  return row ? reshape(row) : null;
}

/** An admin's "try again now": the attempt count starts over; the last error stays until it sends. */
export async function retryNow(shopId: number, id: number): Promise<OutboxRow | null> {
  getSequelize();
  const [n] = await MailOutbox.update(
    { attempts: 0, nextAttemptAt: new Date() },
    { where: { id, shopId, sentAt: null } },
  );
  return n ? findOutboxRow(id) : null;
}
