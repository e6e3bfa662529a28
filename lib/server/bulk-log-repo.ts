import "server-only";
import { QueryTypes, type Transaction } from "sequelize";
import type { SyncEntity } from "@/models";
import type { AuditInput } from "./audit";
import { getSequelize } from "./db";

// recordAudit and recordChange for many rows at once: the same rows, written by one multi-row
// INSERT each, inside the caller's transaction. A batch of 100 readings would otherwise cost
// 200 round trips to the database (bench:sync).

const json = (v: unknown) => (v === undefined || v === null ? null : JSON.stringify(v));

export async function recordAudits(t: Transaction, events: AuditInput[]): Promise<void> {
  if (events.length === 0) return;
  const now = new Date();
  await getSequelize().query(
    `INSERT INTO audit_events (shop_id, user_id, action, entity_type, entity_id, \`before\`, \`after\`, created_at) VALUES ${events.map(() => "(?,?,?,?,?,?,?,?)").join(",")}`,
    {
      replacements: events.flatMap((e) => [e.shopId, e.userId, e.action, e.entityType, String(e.entityId), json(e.before), json(e.after), now]),
      type: QueryTypes.INSERT, transaction: t,
    },
  );
}

export type ChangeInput = { shopId: number; jobId: number; entity: SyncEntity; entityId: string | number; deviceId?: string | null };

/** Returns the id of the last change row written ("0" when none), the push reply's cursor. */
export async function recordChanges(t: Transaction, changes: ChangeInput[]): Promise<string> {
  if (changes.length === 0) return "0";
  // The JS clock, as recordChange uses: the feed's settle window is measured on it.
  const now = new Date();
  const [firstId] = await getSequelize().query(
    `INSERT INTO sync_changes (shop_id, job_id, entity, entity_id, device_id, created_at) VALUES ${changes.map(() => "(?,?,?,?,?,?)").join(",")}`,
    {
      replacements: changes.flatMap((c) => [c.shopId, c.jobId, c.entity, String(c.entityId), c.deviceId ?? null, now]),
      type: QueryTypes.INSERT, transaction: t,
    },
  );
  // One multi-row INSERT takes consecutive auto-increment ids (InnoDB, "simple insert").
  return String(Number(firstId) + changes.length - 1);
}
