import { authed, parseId, readJson } from "@/lib/server/core/route";
import { updateUser } from "@/lib/server/users/admin";
import { updateUserSchema } from "@/lib/schemas/user";

/** Change a person's role, or deactivate / reactivate the account (admin). */
export const PATCH = authed<{ userId: string }>(["admin"], async ({ req, actor, params }) => {
  const id = parseId(params.userId, "User");
  const change = await readJson(req, updateUserSchema);
  return { user: await updateUser(actor, id, change) };
});
