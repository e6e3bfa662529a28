import { open, readJson } from "@/lib/server/core/route";
import { sessionCookieHeader, sessionFromRequest } from "@/lib/server/core/session";
import { AppError } from "@/lib/server/core/errors";
import { verifyShopSchema } from "@/lib/schemas/shop";
import { openSession } from "@/lib/server/sessions/lifecycle";
import { confirmShop } from "@/lib/server/shops/signup";
import { findActiveUser } from "@/lib/server/users/repo";

/**
 * The e-mailed link's button: opens the shop and signs its admin in (the link proved the address),
 * landing on the desk, where the first-job guide waits.
 */
export const POST = open(async ({ req }) => {
  const { token } = await readJson(req, verifyShopSchema);
  const owner = await confirmShop(token);
  const user = await findActiveUser(owner.userId, owner.shopId);
  if (!user) throw new AppError("forbidden", "This account has been switched off; ask your shop's admin");
  const session = await openSession(user, await sessionFromRequest(req));
  return Response.json(
    { shopName: owner.shopName, home: "/desk" },
    { headers: { "Set-Cookie": sessionCookieHeader(session.cookie) } },
  );
});
