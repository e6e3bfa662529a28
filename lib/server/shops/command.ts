import "server-only";
import { parseArgs } from "node:util";
import { newShopSchema, type NewShopInput } from "@/lib/schemas/shop";
import { LINK_PAGES } from "@/lib/server/accounts/link-mail";
import { AppError } from "@/lib/server/core/errors";
import { unusableHash } from "@/lib/server/passwords/hash";
import { issueToken, tokenLink } from "@/lib/server/tokens/service";
import { createShop } from "./create-shop";

// `npm run shop:create -- --name … --admin-email … [--admin-name …] [--units in|mm]`, for a host
// without public sign-up: the shop is open at once and its admin chooses a password through a
// one-time link (the accounts feature's set-password page), printed for the host to pass on.

export const SHOP_CREATE_USAGE =
  'Usage: npm run shop:create -- --name "Shop name" --admin-email admin@shop.example ' +
  '[--admin-name "Their name"] [--units in|mm]';

const FLAG_OF: Record<string, string> = {
  shopName: "--name",
  adminName: "--admin-name",
  email: "--admin-email",
  unitSystem: "--units",
};

/** The command's arguments as the sign-up's fields; throws words naming the flag to fix. */
export function parseShopCreateArgs(argv: string[]): NewShopInput {
  let values;
  try {
    values = parseArgs({
      args: argv,
      options: {
        name: { type: "string" },
        "admin-email": { type: "string" },
        "admin-name": { type: "string" },
        units: { type: "string", default: "in" },
      },
      strict: true,
    }).values;
  } catch (err) {
    throw new Error(`${(err as Error).message}\n${SHOP_CREATE_USAGE}`, { cause: err });
  }
  const email = values["admin-email"] ?? "";
  const parsed = newShopSchema.safeParse({
    shopName: values.name ?? "",
    unitSystem: values.units,
    adminName: values["admin-name"] ?? email.split("@")[0],
    email,
  });
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${FLAG_OF[String(i.path[0])] ?? i.path.join(".")}: ${i.message}`);
    throw new Error(`Fix these and run it again:\n${lines.join("\n")}\n${SHOP_CREATE_USAGE}`);
  }
  return parsed.data;
}

export type CommandResult = { shopId: number; adminId: number; link: string; expiresAt: Date };

export async function createShopFromCommand(input: NewShopInput): Promise<CommandResult> {
  // Nobody knows this password: the admin can sign in only after choosing one through the link.
  const passwordHash = await unusableHash();
  let created;
  try {
    created = await createShop({ ...input, passwordHash, activatedAt: new Date(), via: "command" });
  } catch (err) {
    if (err instanceof AppError) {
      const fields = Object.entries(err.fields ?? {}).map(([k, v]) => `  ${FLAG_OF[k] ?? k}: ${v.join("; ")}`);
      throw new Error([err.message, ...fields].join("\n"), { cause: err });
    }
    throw err;
  }
  const { token, expiresAt } = await issueToken({
    purpose: "set_password",
    userId: created.adminId,
    shopId: created.shopId,
  });
  return { shopId: created.shopId, adminId: created.adminId, link: tokenLink(LINK_PAGES.invitation, token), expiresAt };
}
