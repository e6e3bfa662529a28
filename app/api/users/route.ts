import { authed, readJson } from "@/lib/server/core/route";
import { inviteUser, listShopUsers } from "@/lib/server/users/admin";
import { inviteUserSchema } from "@/lib/schemas/user";

/** The shop's people (admin). */
export const GET = authed(["admin"], async ({ actor }) => ({ users: await listShopUsers(actor.shopId) }));

/** Invite: creates the account with a temporary password, returned once in this reply only. */
export const POST = authed(["admin"], async ({ req, actor }) => {
  const input = await readJson(req, inviteUserSchema);
  return Response.json(await inviteUser(actor, input), { status: 201 });
});
