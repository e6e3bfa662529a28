import { open, readJson } from "@/lib/server/core/route";
import { resendShopLinkSchema } from "@/lib/schemas/shop";
import { resendShopLink } from "@/lib/server/shops/signup";

/** A new confirmation link; the same answer whether or not the address has a shop waiting. */
export const POST = open(async ({ req }) => {
  const { email } = await readJson(req, resendShopLinkSchema);
  await resendShopLink(email);
  return Response.json({ email }, { status: 202 });
});
