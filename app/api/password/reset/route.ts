import { open, readJson } from "@/lib/server/core/route";
import { setPasswordFromLink } from "@/lib/server/accounts/passwords";
import { setPasswordSchema } from "@/lib/schemas/password";

/** A reset from the e-mailed link: the token and the new password; every session of the person ends. */
export const POST = open(async ({ req }) => {
  const input = await readJson(req, setPasswordSchema);
  return setPasswordFromLink("password_reset", input);
});
