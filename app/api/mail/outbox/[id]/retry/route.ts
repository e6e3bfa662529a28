import { recordAudit } from "@/lib/server/log/repo";
import { AppError } from "@/lib/server/core/errors";
import { retryNow } from "@/lib/server/mail/repo";
import { authed, parseId } from "@/lib/server/core/route";

// "Try again now" for a message not yet sent (after the automatic retries gave up, or sooner).
export const POST = authed<{ id: string }>(["admin"], async ({ actor, params }) => {
  const id = parseId(params.id, "Message");
  const row = await retryNow(actor.shopId, id);
  if (!row) throw new AppError("not_found", "No unsent message with this id in your shop's outbox");
  await recordAudit(null, {
    shopId: actor.shopId,
    userId: actor.userId,
    action: "mail.retry",
    entityType: "mail_outbox",
    entityId: id,
    after: { attempts: 0, nextAttemptAt: row.nextAttemptAt.toISOString() },
  });
  return { id: row.id, nextAttemptAt: row.nextAttemptAt.toISOString() };
});
