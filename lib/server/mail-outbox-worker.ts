import "server-only";
import { env } from "./env";
import { sendMail, type OutgoingMail } from "./mail";
import { composeMail } from "./mail-compose";
import { claimDue, markFailed, markSent } from "./mail-outbox";

// Delivers due outbox messages. A failure (mail server down, a record that cannot be rendered)
// is written on the row with the next try time, doubling from MAIL_RETRY_BASE_SECONDS up to six
// hours; after MAIL_MAX_ATTEMPTS the row waits for an admin's "try again" on the mail page.
const MAX_DELAY_SECONDS = 6 * 3600;

export type DeliveryReport = { sent: number[]; failed: { id: number; error: string; nextAttemptAt: Date }[] };

/** Seconds to wait after the n-th failed attempt (n ≥ 1). */
export function retryDelaySeconds(attempts: number, base = env().MAIL_RETRY_BASE_SECONDS): number {
  return Math.min(base * 2 ** Math.max(0, attempts - 1), MAX_DELAY_SECONDS);
}

const describe = (err: unknown) => (err instanceof Error ? err.message : String(err)) || "Unknown error";

export async function deliverPendingMail(opts: { now?: Date; limit?: number; send?: (m: OutgoingMail) => Promise<unknown> } = {}): Promise<DeliveryReport> {
  const now = opts.now ?? new Date();
  const send = opts.send ?? sendMail;
  const report: DeliveryReport = { sent: [], failed: [] };
  for (const row of await claimDue(now, opts.limit ?? 20)) {
    try {
      await send(await composeMail(row));
      await markSent(row.id, new Date());
      report.sent.push(row.id);
    } catch (err) {
      const attempts = row.attempts + 1;
      const nextAttemptAt = new Date(now.getTime() + retryDelaySeconds(attempts) * 1000);
      const error = `Attempt ${attempts} at ${now.toISOString()}: ${describe(err)}`;
      await markFailed(row.id, attempts, error, nextAttemptAt);
      report.failed.push({ id: row.id, error, nextAttemptAt });
    }
  }
  return report;
}
