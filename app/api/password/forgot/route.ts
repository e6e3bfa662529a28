import { clientAddress } from "@/lib/server/core/client-address";
import { open, readJson } from "@/lib/server/core/route";
import { requestPasswordReset } from "@/lib/server/accounts/forgot";
import { deliverSoon } from "@/lib/server/mail/outbox-worker";
import { forgotPasswordSchema } from "@/lib/schemas/password";

/** Asks for a reset link: 202 with the same words whether or not the address has an account; throttled. */
export const POST = open(async ({ req }) => {
  const { email } = await readJson(req, forgotPasswordSchema);
  const { message, shopIds } = await requestPasswordReset(email, clientAddress(req));
  deliverSoon(shopIds, ["password_reset"]);
  return Response.json({ message }, { status: 202 });
});
