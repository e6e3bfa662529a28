import { ROLE_HOME } from "@/lib/server/core/access";
import { authed } from "@/lib/server/core/route";
import { findShop } from "@/lib/server/users/repo";

export const GET = authed("any", async ({ actor }) => {
  const shop = await findShop(actor.shopId);
  return {
    user: { id: actor.userId, name: actor.name, email: actor.email, role: actor.role },
    shop,
    home: ROLE_HOME[actor.role],
    // A tablet remembers which sign-in it holds, to end it on the server after signing out offline.
    sessionId: actor.sessionId ?? null,
  };
});
