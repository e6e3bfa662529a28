// One-time link tokens on the real database: stored only as a SHA-256, used once, refused when
// expired, used, replaced by a newer link, or meant for something else; two requests racing with
// the same token give exactly one success.
import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { getSequelize } from "@/lib/server/core/db";
import { AppError } from "@/lib/server/core/errors";
import { checkToken, consumeToken, issueToken, tokenProblemWords } from "@/lib/server/tokens/service";
import { LinkToken } from "@/models";
import { createShop } from "../support/factories";

async function refusal(p: Promise<unknown>): Promise<AppError> {
  const err = await p.then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(AppError);
  return err as AppError;
}

describe("link tokens", () => {
  it("keeps only the SHA-256 of a 256-bit base64url token and hands the owner back once", async () => {
    const { shop, users } = await createShop();
    const before = Date.now();
    const { token, expiresAt } = await issueToken({
      purpose: "set_password",
      userId: users.machinist.id,
      shopId: shop.id,
      ttlMinutes: 30,
    });
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/); // 32 bytes in base64url, no padding (RFC 4648, section 5)
    expect(expiresAt.getTime() - before).toBeGreaterThanOrEqual(30 * 60_000 - 1000);
    expect(expiresAt.getTime() - before).toBeLessThanOrEqual(30 * 60_000 + 5000);
    const rows = await LinkToken.findAll({ where: { userId: users.machinist.id }, raw: true });
    expect(rows).toHaveLength(1);
    expect(JSON.stringify(rows)).not.toContain(token);
    expect(rows[0].tokenHash).toBe(createHash("sha256").update(token).digest("hex"));

    expect(await checkToken("set_password", token)).toMatchObject({ userId: users.machinist.id, shopId: shop.id });
    expect(await consumeToken("set_password", token)).toEqual({ userId: users.machinist.id, shopId: shop.id });
    const again = await refusal(consumeToken("set_password", token));
    expect(again.status).toBe(410);
    expect(again.message).toBe(tokenProblemWords("set_password", "used"));
    expect(again.fields?.token).toEqual([again.message]);
  });

  it("refuses an expired link, an unknown one and one meant for something else, with words for each", async () => {
    const { shop, users } = await createShop();
    const { token } = await issueToken({ purpose: "reset_password", userId: users.lead.id, shopId: shop.id });
    await LinkToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: users.lead.id } });
    const expired = await refusal(consumeToken("reset_password", token));
    expect(expired.message).toMatch(/expired/);
    expect(expired.message).toMatch(/Forgot password/);
    expect((await refusal(checkToken("reset_password", token))).message).toBe(expired.message);

    const unknown = await refusal(consumeToken("reset_password", "not-a-token-we-sent"));
    expect(unknown.message).toBe(tokenProblemWords("reset_password", "unknown"));

    const fresh = await issueToken({ purpose: "verify_email", userId: users.lead.id, shopId: shop.id });
    const wrongKind = await refusal(consumeToken("reset_password", fresh.token));
    expect(wrongKind.message).toBe(tokenProblemWords("reset_password", "unknown"));
    // Asking under the wrong purpose does not use the link up.
    expect(await consumeToken("verify_email", fresh.token)).toEqual({ userId: users.lead.id, shopId: shop.id });
  });

  it("voids the person's earlier unused links of the same purpose, and only those", async () => {
    const { shop, users } = await createShop();
    const ids = { userId: users.inspector.id, shopId: shop.id };
    const first = await issueToken({ purpose: "reset_password", ...ids });
    const otherKind = await issueToken({ purpose: "verify_email", ...ids });
    const otherPerson = await issueToken({ purpose: "reset_password", userId: users.admin.id, shopId: shop.id });
    const second = await issueToken({ purpose: "reset_password", ...ids });
    const replaced = await refusal(consumeToken("reset_password", first.token));
    expect(replaced.message).toBe(tokenProblemWords("reset_password", "replaced"));
    expect(await consumeToken("reset_password", second.token)).toEqual(ids);
    expect(await consumeToken("verify_email", otherKind.token)).toEqual(ids);
    expect((await consumeToken("reset_password", otherPerson.token)).userId).toBe(users.admin.id);
  });

  it("rolls the use back with the caller's transaction", async () => {
    const { shop, users } = await createShop();
    const { token } = await issueToken({ purpose: "set_password", userId: users.admin.id, shopId: shop.id });
    const failed = getSequelize().transaction(async (t) => {
      await consumeToken("set_password", token, t);
      throw new Error("the caller's own work failed");
    });
    await expect(failed).rejects.toThrow("the caller's own work failed");
    expect(await consumeToken("set_password", token)).toEqual({ userId: users.admin.id, shopId: shop.id });
  });

  it("lets exactly one of several racing requests use the same link", async () => {
    const { shop, users } = await createShop();
    const { token } = await issueToken({ purpose: "set_password", userId: users.lead.id, shopId: shop.id });
    const results = await Promise.allSettled(Array.from({ length: 5 }, () => consumeToken("set_password", token)));
    const won = results.filter((r) => r.status === "fulfilled");
    const lost = results.filter((r): r is PromiseRejectedResult => r.status === "rejected");
    expect(won).toHaveLength(1);
    expect(lost).toHaveLength(4);
    for (const r of lost) expect((r.reason as AppError).message).toBe(tokenProblemWords("set_password", "used"));
  });
});
