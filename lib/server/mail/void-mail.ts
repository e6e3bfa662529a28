import "server-only";
import type { Transaction } from "sequelize";
import { env } from "@/lib/server/core/env";
import { releaseMailKey } from "@/lib/server/mail/outbox";
import { addressesQueuedUnder, enqueueMail, mailParties, recordAddressee } from "@/lib/server/mail/repo";

// The customer's notice that a build record they were sent is void: queued in the reopen's
// transaction (so it stands or falls with the void), once per address the record went to, and
// only when the record was sent at all: a customer who never got it has nothing to throw away.

export type VoidedRelease = {
  shopId: number;
  jobId: number;
  releaseId: number;
  hash: string;
  signedAt: Date;
  /** The signer's registered name (the users table), as every record prints it. */
  signerName: string;
  reason: string;
  voidedAt: Date;
};

const day = (d: Date) => d.toISOString().slice(0, 10);
const voidKey = (releaseId: number, n: number) => `record_voided:release:${releaseId}:${n}`;

function voidText(
  v: VoidedRelease,
  who: { customerName: string; shopName: string; shopContact: string[] },
  job: {
    code: string;
    title: string;
  },
): string {
  const verify = `${env().APP_URL.replace(/\/$/, "")}/verify?job=${encodeURIComponent(job.code)}&hash=${v.hash}`;
  const contact = who.shopContact.length ? ` (${who.shopContact.join(", ")})` : "";
  return [
    `Hello ${who.customerName || "there"},`,
    `The build record ${who.shopName} sent you for job ${job.code}, ${job.title} ` +
      `(released by ${v.signerName} on ${day(v.signedAt)}), is VOID as of ${day(v.voidedAt)}. ` +
      `The shop reopened the job. Reason: ${v.reason}`,
    "Please do not assemble the engine from that record, and set aside any printed copy. " +
      "When the job is released again, a new build record follows by e-mail, with its own fingerprint.",
    `The void record's fingerprint was ${v.hash}. Its verification page now shows it as void:\n${verify}`,
    `Questions go to ${who.shopName}${contact}.`,
  ].join("\n\n");
}

/** Queues the notice to every address the record was sent to; the number queued (0 when none was sent). */
export async function enqueueVoidMail(t: Transaction, v: VoidedRelease): Promise<number> {
  const addresses = await addressesQueuedUnder(t, releaseMailKey(v.releaseId));
  if (!addresses.length) return 0;
  const [job, who] = await Promise.all([recordAddressee(t, v.shopId, v.jobId), mailParties(t, v.shopId, v.jobId)]);
  if (!job || !who) return 0;
  const text = voidText(v, who, job);
  let queued = 0;
  for (const [n, to] of addresses.entries()) {
    const payload = { text, jobId: v.jobId, releaseId: v.releaseId };
    const subject = `VOID: build record ${job.code}, ${job.title}`;
    if (
      await enqueueMail(t, {
        shopId: v.shopId,
        kind: "record_voided",
        to,
        subject,
        payload,
        dedupeKey: voidKey(v.releaseId, n),
      })
    )
      queued += 1;
  }
  return queued;
}
