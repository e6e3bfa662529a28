import { authed, readJson } from "@/lib/server/core/route";
import { inviteUser, listShopUsers } from "@/lib/server/users/admin";
import { deliverSoon } from "@/lib/server/mail/outbox-worker";
import { inviteUserSchema } from "@/lib/schemas/user";

/** The shop's people (admin). */
export const GET = authed(["admin"], async ({ actor }) => ({ users: await listShopUsers(actor.shopId) }));

/** Invite: creates the account and e-mails a one-time link where the person chooses their password. */
export const POST = authed(["admin"], async ({ req, actor }) => {
  const input = await readJson(req, inviteUserSchema);
  const invited = await inviteUser(actor, input);
  deliverSoon([actor.shopId], ["invitation"]);
  return Response.json(invited, { status: 201 });
});
