import { open, readJson } from "@/lib/server/core/route";
import { setPasswordFromLink } from "@/lib/server/accounts/passwords";
import { setPasswordSchema } from "@/lib/schemas/password";

/** Accepting an invitation: the e-mailed link's token and the password the person chose. */
export const POST = open(async ({ req }) => {
  const input = await readJson(req, setPasswordSchema);
  return setPasswordFromLink("invitation", input);
});
