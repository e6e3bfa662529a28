// `npm run shop:create`: the host's way to make a shop without public sign-up. The command is run
// for real (a child process on the test database) and its printed link is checked as the admin
// would use it; the argument checks are called directly.
import { execFile } from "node:child_process";
import { randomUUID } from "node:crypto";
import { promisify } from "node:util";
import { describe, expect, it } from "vitest";
import { parseShopCreateArgs } from "@/lib/server/shops/command";
import { checkToken } from "@/lib/server/tokens/service";
import { Shop, SpecTemplate, User } from "@/models";
import { getSequelize } from "@/lib/server/core/db";

const run = promisify(execFile);

async function shopCreate(args: string[]) {
  try {
    const { stdout } = await run("node", ["scripts/with-services.mjs", "scripts/shop-create.ts", ...args], {
      env: process.env,
    });
    return { code: 0, out: stdout };
  } catch (err) {
    const e = err as { code: number; stdout: string; stderr: string };
    return { code: e.code, out: `${e.stdout}${e.stderr}` };
  }
}

describe("npm run shop:create", () => {
  it("makes an open shop, its admin and starter sheets, and prints a one-time set-password link", async () => {
    getSequelize();
    const tag = randomUUID().slice(0, 8);
    const email = `owner-${tag}@harbor.example`;
    const r = await shopCreate(["--name", `Harbor Engine ${tag}`, "--admin-email", email, "--units", "mm"]);
    expect(r.code).toBe(0);
    const shop = (await Shop.findOne({ where: { name: `Harbor Engine ${tag}` } }))!;
    expect(shop.activatedAt).not.toBeNull();
    expect(shop.unitSystem).toBe("mm");
    const admin = (await User.findOne({ where: { shopId: shop.id } }))!;
    expect(admin).toMatchObject({ role: "admin", email, name: `owner-${tag}` });
    expect(await SpecTemplate.count({ where: { shopId: shop.id } })).toBe(3);
    const link = r.out.match(/https?:\/\/\S+\/set-password\/([A-Za-z0-9_-]+)/);
    expect(link).not.toBeNull();
    expect(await checkToken("set_password", link![1])).toMatchObject({ userId: admin.id, shopId: shop.id });
  }, 90_000);

  it("refuses a name already taken, naming the flag, and makes nothing", async () => {
    const tag = randomUUID().slice(0, 8);
    const first = await shopCreate(["--name", `Delta Bore ${tag}`, "--admin-email", `a-${tag}@delta.example`]);
    expect(first.code).toBe(0);
    const again = await shopCreate(["--name", `delta bore ${tag}`, "--admin-email", `b-${tag}@delta.example`]);
    expect(again.code).toBe(1);
    expect(again.out).toContain("--name:");
    expect(await User.count({ where: { email: `b-${tag}@delta.example` } })).toBe(0);
  }, 90_000);

  it("says which flag to fix for missing or bad arguments", () => {
    expect(() => parseShopCreateArgs(["--admin-email", "x@y.example"])).toThrow(/--name: Enter the shop's name/);
    expect(() => parseShopCreateArgs(["--name", "Alder", "--admin-email", "nope"])).toThrow(
      /--admin-email: Enter an e-mail/,
    );
    expect(() => parseShopCreateArgs(["--name", "Alder", "--admin-email", "a@b.example", "--units", "cm"])).toThrow(
      /--units: Pick inch or metric/,
    );
    expect(() => parseShopCreateArgs(["--nme", "Alder"])).toThrow(/Usage: npm run shop:create/);
    expect(parseShopCreateArgs(["--name", " Alder Machine ", "--admin-email", "Ann@Alder.example"])).toEqual({
      shopName: "Alder Machine",
      unitSystem: "in",
      adminName: "Ann",
      email: "ann@alder.example",
    });
  });
});
