import { homeFor } from "@/lib/server/core/access";
import { authed } from "@/lib/server/core/route";
import { findShop } from "@/lib/server/users/repo";

// Open while a password change is owed: the tablet learns from here to send the person to it.
export const GET = authed(
  "any",
  async ({ actor }) => {
    const shop = await findShop(actor.shopId);
    return {
      user: { id: actor.userId, name: actor.name, email: actor.email, role: actor.role },
      shop,
      home: homeFor(actor),
      mustChangePassword: actor.mustChangePassword ?? false,
      // A tablet remembers which sign-in it holds, to end it on the server after signing out offline.
      sessionId: actor.sessionId ?? null,
    };
  },
  { whilePasswordMustChange: true },
);
