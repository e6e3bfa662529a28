import { open, readJson } from "@/lib/server/core/route";
import { shopSignUpSchema } from "@/lib/schemas/shop";
import { startShop } from "@/lib/server/shops/signup";

/** Start a shop from the public page: made closed, opened by the link e-mailed to its first admin. */
export const POST = open(async ({ req }) => {
  const input = await readJson(req, shopSignUpSchema);
  return Response.json(await startShop(input), { status: 201 });
});
