import { listOutbox } from "@/lib/server/mail/repo";
import { authed } from "@/lib/server/core/route";

// The shop's outgoing mail, newest first, with attempts and the last error; admin only.
export const GET = authed(["admin"], async ({ actor }) => {
  const rows = await listOutbox(actor.shopId);
  return {
    messages: rows.map(({ payload: _p, dedupeKey: _d, ...m }) => ({
      ...m,
      nextAttemptAt: m.nextAttemptAt.toISOString(),
      sentAt: m.sentAt?.toISOString() ?? null,
      createdAt: m.createdAt.toISOString(),
    })),
  };
});
