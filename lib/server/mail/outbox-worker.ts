import "server-only";
import { env, isBuildPhase } from "@/lib/server/core/env";
import { sendMail, type OutgoingMail } from "@/lib/server/mail/send";
import { composeMail } from "@/lib/server/mail/compose";
import { claimDue, markFailed, markSent, unsentIds } from "@/lib/server/mail/repo";
import type { MailKind } from "@/lib/schemas/mail";

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

/** `only` restricts a run to these outbox ids (an admin's "send this one now", and tests). */
type DeliverOptions = {
  now?: Date;
  limit?: number;
  budgetMs?: number;
  only?: number[];
  send?: (m: OutgoingMail) => Promise<unknown>;
};

/**
 * Sends due messages one claim at a time, up to `limit` or until `budgetMs` has passed (a build
 * record takes a PDF render), so a backlog is worked off over several passes, never in one long one.
 */
export async function deliverPendingMail(opts: DeliverOptions = {}): Promise<DeliveryReport> {
  const now = opts.now ?? new Date();
  const send = opts.send ?? sendMail;
  const until = Date.now() + (opts.budgetMs ?? 20_000);
  const report: DeliveryReport = { sent: [], failed: [] };
  for (let i = 0; i < (opts.limit ?? 20) && Date.now() < until; i++) {
    const [row] = await claimDue(now, 1, opts.only);
    if (!row) break;
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

/**
 * Sends what is due now, in the background, without holding up the request: someone waiting for a
 * link should not wait for the notifier's next pass. Failures stay on their rows for the retries.
 */
export function deliverSoon(shopIds: number[], kinds: MailKind[]): void {
  if (isBuildPhase() || !shopIds.length) return;
  const run = async () => {
    const only = await unsentIds(shopIds, kinds);
    if (only.length) await deliverPendingMail({ only, limit: 5, budgetMs: 10_000 });
  };
  setTimeout(() => void run().catch((err) => console.error("[tenthwise] mail delivery", err)), 0);
}
