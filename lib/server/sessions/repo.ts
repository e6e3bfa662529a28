import "server-only";
import { randomBytes } from "node:crypto";
import { Op, type Transaction } from "sequelize";
import { models } from "@/lib/server/core/db";
import { causalRows } from "@/lib/server/core/cluster";
import type { SessionEndReason } from "@/lib/schemas/enums";

// The user_sessions rows: one per sign-in, ended on the server so a cookie left on a shared tablet
// (or copied off it) stops working. Ids are 128 random bits in hex.

export async function createSessionRow(userId: number, shopId: number): Promise<string> {
  const { UserSession } = models();
  const id = randomBytes(16).toString("hex");
  await UserSession.create({ id, userId, shopId });
  return id;
}

/**
 * Whether this sign-in of this person still counts. A session not found is looked for once more
 * with a causal read (core/cluster.ts): on a cluster the sign-in may have been written through
 * another instance's node a moment ago, and a person just signed in must not be sent back to sign in.
 */
export async function isSessionLive(id: string, userId: number): Promise<boolean> {
  const { UserSession } = models();
  if (await UserSession.findOne({ where: { id, userId, endedAt: null }, attributes: ["id"] })) return true;
  const rows = await causalRows<{ id: string }>(
    null,
    "SELECT id FROM user_sessions WHERE id = ? AND user_id = ? AND ended_at IS NULL",
    [id, userId],
  );
  return rows.length > 0;
}

/** Ends one session, whoever it belongs to; answers whether it was still live. */
export async function endSessionRow(id: string, reason: SessionEndReason): Promise<boolean> {
  const { UserSession } = models();
  const [count] = await UserSession.update(
    { endedAt: new Date(), endedReason: reason },
    { where: { id, endedAt: null } },
  );
  return count > 0;
}

/** Ends every live session of one person except `keep`; answers how many ended. */
export async function endUserSessionRows(
  t: Transaction,
  userId: number,
  reason: SessionEndReason,
  keep?: string,
): Promise<number> {
  const { UserSession } = models();
  const [count] = await UserSession.update(
    { endedAt: new Date(), endedReason: reason },
    { where: { userId, endedAt: null, ...(keep ? { id: { [Op.ne]: keep } } : {}) }, transaction: t },
  );
  return count;
}

/** Forgets this person's sessions that ended or were opened before `before` (their cookies expired). */
export async function pruneSessionRows(userId: number, before: Date): Promise<void> {
  const { UserSession } = models();
  await UserSession.destroy({
    where: { userId, [Op.or]: [{ endedAt: { [Op.ne]: null } }, { createdAt: { [Op.lt]: before } }] },
  });
}
