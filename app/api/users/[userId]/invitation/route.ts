import { authed, parseId } from "@/lib/server/core/route";
import { deliverSoon } from "@/lib/server/mail/outbox-worker";
import { resendInvitation } from "@/lib/server/users/admin";

/** Send the invitation again with a fresh link (admin); only for someone who has not signed in yet. */
export const POST = authed<{ userId: string }>(["admin"], async ({ actor, params }) => {
  const sent = await resendInvitation(actor, parseId(params.userId, "User"));
  deliverSoon([actor.shopId], ["invitation"]);
  return sent;
});
