import "server-only";
import { Op, type Transaction } from "sequelize";
import { models } from "@/lib/server/core/db";
import type { LinkPurpose } from "@/lib/schemas/enums";

// The link_tokens rows, as plain objects. Rows are found by the SHA-256 of the token, never by the
// token itself, which is not stored.

export type TokenRow = {
  id: number;
  purpose: LinkPurpose;
  userId: number;
  shopId: number;
  expiresAt: Date;
  usedAt: Date | null;
  voidedAt: Date | null;
};

export type NewTokenRow = { tokenHash: string; purpose: LinkPurpose; userId: number; shopId: number; expiresAt: Date };

export async function insertTokenRow(t: Transaction, row: NewTokenRow): Promise<void> {
  const { LinkToken } = models();
  await LinkToken.create(row, { transaction: t });
}

/** Voids the person's links of this purpose that are neither used nor voided yet; answers how many. */
export async function voidUnusedTokenRows(
  t: Transaction,
  userId: number,
  purpose: LinkPurpose,
  now: Date,
): Promise<number> {
  const { LinkToken } = models();
  const [count] = await LinkToken.update(
    { voidedAt: now },
    { where: { userId, purpose, usedAt: null, voidedAt: null }, transaction: t },
  );
  return count;
}

/**
 * Marks the link used if it is still good at `now`, in one UPDATE: of two requests racing with the
 * same token, the second waits on the row lock and then finds used_at set. Answers whether it did.
 */
export async function claimTokenRow(t: Transaction, tokenHash: string, purpose: LinkPurpose, now: Date) {
  const { LinkToken } = models();
  const [count] = await LinkToken.update(
    { usedAt: now },
    {
      where: { tokenHash, purpose, usedAt: null, voidedAt: null, expiresAt: { [Op.gt]: now } },
      transaction: t,
    },
  );
  return count === 1;
}

export async function findTokenRow(tokenHash: string, t?: Transaction): Promise<TokenRow | null> {
  const { LinkToken } = models();
  const row = await LinkToken.findOne({ where: { tokenHash }, transaction: t });
  if (!row) return null;
  return {
    id: row.id,
    purpose: row.purpose,
    userId: row.userId,
    shopId: row.shopId,
    expiresAt: row.expiresAt,
    usedAt: row.usedAt ?? null,
    voidedAt: row.voidedAt ?? null,
  };
}
