import { authed, readJson } from "@/lib/server/core/route";
import { changeOwnPassword } from "@/lib/server/accounts/passwords";
import { changePasswordSchema } from "@/lib/schemas/password";

/** Changing one's own password (the current one required); open while a temporary one must be changed. */
export const POST = authed(
  "any",
  async ({ req, actor }) => changeOwnPassword(actor, await readJson(req, changePasswordSchema)),
  { whilePasswordMustChange: true },
);
