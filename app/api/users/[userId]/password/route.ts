import { authed, parseId } from "@/lib/server/core/route";
import { resetPassword } from "@/lib/server/users/admin";

/** Reset a password: a temporary one, returned once in this reply only, to be changed at the next sign-in (admin). */
export const POST = authed<{ userId: string }>(["admin"], async ({ actor, params }) => {
  return resetPassword(actor, parseId(params.userId, "User"));
});
