import "server-only";
import { createHash } from "node:crypto";
import type { NewShopInput } from "@/lib/schemas/shop";
import { getSequelize } from "@/lib/server/core/db";
import { AppError } from "@/lib/server/core/errors";
import { recordAudit } from "@/lib/server/log/repo";
import { emailHasAccount, insertPerson, insertSheets, insertShop, shopNameTaken, ShopTaken } from "./repo";
import { STARTER_SHEETS } from "./starter-sheets";

// A new shop, its first admin and its starter spec sheets, in one transaction: the public sign-up
// (signup.ts) and `npm run shop:create` both come here, so a shop is never half made.

export type CreateShopInput = NewShopInput & {
  passwordHash: string;
  /** When the shop became usable: now for the command, null until the e-mailed link is opened. */
  activatedAt: Date | null;
  via: "sign_up" | "command";
};
export type CreatedShop = { shopId: number; adminId: number; slug: string; sheetIds: number[] };

/** The shop's address-safe name: "Vega & Sons Machine" → "vega-sons-machine". */
export function shopSlug(name: string): string {
  const slug = name
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 48)
    .replace(/-+$/, "");
  // A name with no Latin letters or digits still gets its own, stable slug.
  return slug || `shop-${createHash("sha256").update(name).digest("hex").slice(0, 12)}`;
}

const nameTaken = (name: string) =>
  new AppError("conflict", `A shop named "${name}" already exists`, {
    shopName: [`"${name}" (or a name written the same way) is taken; add your town or another word`],
  });

const emailTaken = () =>
  new AppError("conflict", "That e-mail address already has a Tenthwise account", {
    email: ["This address already has an account: sign in with it, or use another address for this shop"],
  });

export async function createShop(input: CreateShopInput): Promise<CreatedShop> {
  const slug = shopSlug(input.shopName);
  if (await shopNameTaken(input.shopName, slug)) throw nameTaken(input.shopName);
  if (await emailHasAccount(input.email)) throw emailTaken();
  try {
    return await getSequelize().transaction(async (t) => {
      const shopId = await insertShop(t, {
        name: input.shopName,
        slug,
        unitSystem: input.unitSystem,
        activatedAt: input.activatedAt,
      });
      const admin = { name: input.adminName, email: input.email, passwordHash: input.passwordHash };
      const adminId = await insertPerson(t, shopId, { ...admin, role: "admin" });
      const sheetIds = await insertSheets(t, shopId, STARTER_SHEETS);
      await recordAudit(t, {
        shopId,
        userId: input.via === "sign_up" ? adminId : null,
        action: "shop.create",
        entityType: "shop",
        entityId: shopId,
        after: {
          name: input.shopName,
          slug,
          unitSystem: input.unitSystem,
          admin: { id: adminId, name: input.adminName, email: input.email },
          starterSheets: sheetIds,
          via: input.via,
          activated: input.activatedAt !== null,
        },
      });
      return { shopId, adminId, slug, sheetIds };
    });
  } catch (err) {
    if (err instanceof ShopTaken) throw nameTaken(input.shopName);
    throw err;
  }
}
