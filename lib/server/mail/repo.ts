import "server-only";
import { Op, UniqueConstraintError, type Transaction } from "sequelize";
import type { MailOutbox } from "@/models";
import type { JsonObject } from "@/lib/schemas/json";
import type { MailKind, OutboxMessage } from "@/lib/schemas/mail";
import { models } from "@/lib/server/core/db";
import { env } from "@/lib/server/core/env";
import { isConflict } from "@/lib/server/core/cluster";

// The mail outbox's rows: queued in the caller's transaction, claimed and marked by the worker,
// listed and retried by the admin. Plain objects out.

/** An outbox row with what the worker needs to compose it. */
export type OutboxRow = OutboxMessage & { payload: JsonObject; dedupeKey: string | null };

export type NewMail = {
  shopId: number;
  kind: MailKind;
  to: string;
  subject: string;
  payload: JsonObject;
  dedupeKey?: string;
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
  const { MailOutbox } = models();
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

/** Whom a job's build record goes to, and its code and title; null when the job is not the shop's. */
export async function recordAddressee(
  t: Transaction | null,
  shopId: number,
  jobId: number,
): Promise<{ code: string; title: string; email: string | null } | null> {
  const { Customer, Job } = models();
  const job = await Job.findOne({ where: { id: jobId, shopId }, transaction: t ?? undefined });
  if (!job) return null;
  const customer = await Customer.findOne({ where: { id: job.customerId, shopId }, transaction: t ?? undefined });
  return { code: job.code, title: job.title, email: customer?.email || null };
}

/**
 * The addresses a message was queued to under `key` or one of its follow-ups (`key:…`, e.g. a
 * resend), oldest first; empty when nothing was queued under it.
 */
export async function addressesQueuedUnder(t: Transaction | null, key: string): Promise<string[]> {
  const { MailOutbox } = models();
  const rows = await MailOutbox.findAll({
    where: { [Op.or]: [{ dedupeKey: key }, { dedupeKey: { [Op.startsWith]: `${key}:` } }] },
    attributes: ["toAddress"],
    order: [["id", "ASC"]],
    transaction: t ?? undefined,
  });
  return [...new Set(rows.map((r) => r.toAddress))];
}

/** The names a mail to a job's customer is written with: the customer's and the shop's, with its contact. */
export async function mailParties(
  t: Transaction | null,
  shopId: number,
  jobId: number,
): Promise<{ customerName: string; shopName: string; shopContact: string[] } | null> {
  const { Customer, Job, Shop } = models();
  const job = await Job.findOne({ where: { id: jobId, shopId }, transaction: t ?? undefined });
  if (!job) return null;
  const [customer, shop] = await Promise.all([
    Customer.findOne({ where: { id: job.customerId, shopId }, transaction: t ?? undefined }),
    Shop.findByPk(shopId, { transaction: t ?? undefined }),
  ]);
  const contact = [shop?.phone, shop?.email].filter((x): x is string => !!x && x.trim() !== "");
  return { customerName: customer?.name ?? "", shopName: shop?.name ?? "", shopContact: contact };
}

/** Whether any message with this dedupe key prefix was queued (e.g. one job's "ready" mails). */
export async function queuedWithPrefix(prefix: string): Promise<boolean> {
  const { MailOutbox } = models();
  return (await MailOutbox.count({ where: { dedupeKey: { [Op.startsWith]: prefix } } })) > 0;
}

/** Ids of the shop's unsent messages of these kinds (a link someone is waiting for). */
export async function unsentIds(shopIds: number[], kinds: MailKind[]): Promise<number[]> {
  const { MailOutbox } = models();
  const rows = await MailOutbox.findAll({ where: { shopId: shopIds, kind: kinds, sentAt: null }, attributes: ["id"] });
  return rows.map((r) => r.id);
}

/**
 * Claims due messages for this worker: each claim pushes next_attempt_at past a lease in one
 * committed conditional UPDATE (still unsent, still due, as many attempts as we read), so two
 * workers never send the same message. On one database the second UPDATE waits for the first and
 * then matches nothing. On a Galera cluster a worker on another node may still read the message as
 * due and its UPDATE matches locally, but both write the same row, so certification fails the later
 * commit (1213; the server may retry the statement once, which then matches nothing): a lost claim.
 */
export async function claimDue(now: Date, limit: number, only?: number[], leaseSeconds = 300): Promise<OutboxRow[]> {
  const { MailOutbox } = models();
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
    // More than asked for: a claim another worker wins is passed over for the next message.
    limit: limit * 4,
  });
  const lease = new Date(now.getTime() + leaseSeconds * 1000);
  const claimed: OutboxRow[] = [];
  for (const m of due) {
    if (claimed.length >= limit) break;
    const claim = MailOutbox.update(
      { nextAttemptAt: lease },
      { where: { id: m.id, sentAt: null, attempts: m.attempts, nextAttemptAt: { [Op.lte]: now } } },
    );
    const [n] = await claim.catch((err: unknown) => {
      if (isConflict(err)) return [0];
      throw err;
    });
    if (n === 1) claimed.push(reshape(m));
  }
  return claimed;
}

export async function markSent(id: number, at: Date): Promise<void> {
  const { MailOutbox } = models();
  await MailOutbox.update({ sentAt: at, lastError: null }, { where: { id } });
}

export async function markFailed(id: number, attempts: number, error: string, nextAttemptAt: Date): Promise<void> {
  const { MailOutbox } = models();
  await MailOutbox.update({ attempts, lastError: error.slice(0, 2000), nextAttemptAt }, { where: { id } });
}

/** The shop's latest messages, newest first, for the admin mail page. */
export async function listOutbox(shopId: number, limit = 100): Promise<OutboxRow[]> {
  const { MailOutbox } = models();
  const rows = await MailOutbox.findAll({ where: { shopId }, order: [["id", "DESC"]], limit });
  return rows.map(reshape);
}

export async function findOutboxRow(id: number): Promise<OutboxRow | null> {
  const { MailOutbox } = models();
  const row = await MailOutbox.findByPk(id);
  return row ? reshape(row) : null;
}

/** An admin's "try again now": the attempt count starts over; the last error stays until it sends. */
export async function retryNow(shopId: number, id: number): Promise<OutboxRow | null> {
  const { MailOutbox } = models();
  const [n] = await MailOutbox.update(
    { attempts: 0, nextAttemptAt: new Date() },
    { where: { id, shopId, sentAt: null } },
  );
  return n ? findOutboxRow(id) : null;
}
