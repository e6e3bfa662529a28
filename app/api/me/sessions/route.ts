import { authed } from "@/lib/server/core/route";
import { clearSessionCookieHeader } from "@/lib/server/core/session";
import { signOutEverywhere } from "@/lib/server/accounts/passwords";

/** Sign out everywhere: every session of the person ends, this one too, and its cookie is cleared. */
export const DELETE = authed(
  "any",
  async ({ actor }) => {
    const sessionsEnded = await signOutEverywhere(actor);
    return Response.json({ sessionsEnded }, { headers: { "Set-Cookie": clearSessionCookieHeader() } });
  },
  { whilePasswordMustChange: true },
);
