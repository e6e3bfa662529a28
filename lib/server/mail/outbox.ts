import "server-only";
import { randomUUID } from "node:crypto";
import type { Transaction } from "sequelize";
import { enqueueMail, recordAddressee } from "@/lib/server/mail/repo";

// The mail outbox: a message is written in the same transaction as what causes it and sent later
// by the worker (outbox-worker.ts), so a mail server that is down never blocks a release. A dedupe
// key makes an event queue its message once, however many app instances notice it.

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
  const to = await recordAddressee(t, o.shopId, o.jobId);
  if (!to?.email) return false;
  return enqueueMail(t, {
    shopId: o.shopId,
    kind: "build_record",
    to: to.email,
    dedupeKey,
    subject: `Build record ${to.code}: ${to.title}`,
    payload: { jobId: o.jobId, releaseId: o.releaseId },
  });
}
