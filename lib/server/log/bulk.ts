import "server-only";
import type { Transaction } from "sequelize";
import type { SyncEntity } from "@/lib/schemas/enums";
import type { AuditInput } from "@/lib/server/log/audit";
import { insertMany } from "@/lib/server/core/sql-insert";

// recordAudit and recordChange for many rows at once: the same rows, written by one multi-row
// INSERT each, inside the caller's transaction. A batch of 100 readings would otherwise cost
// 200 round trips to the database (bench:sync).

const json = (v: unknown) => (v === undefined || v === null ? null : JSON.stringify(v));

export async function recordAudits(t: Transaction, events: AuditInput[]): Promise<void> {
  if (events.length === 0) return;
  const now = new Date();
  await insertMany(
    t,
    "audit_events",
    ["shop_id", "user_id", "action", "entity_type", "entity_id", "before", "after", "created_at"],
    events.map((e) => [
      e.shopId,
      e.userId,
      e.action,
      e.entityType,
      String(e.entityId),
      json(e.before),
      json(e.after),
      now,
    ]),
  );
}

export type ChangeInput = {
  shopId: number;
  jobId: number;
  entity: SyncEntity;
  entityId: string | number;
  deviceId?: string | null;
};

/** Returns the id of the last change row written ("0" when none), the push reply's cursor. */
export async function recordChanges(t: Transaction, changes: ChangeInput[]): Promise<string> {
  if (changes.length === 0) return "0";
  // The JS clock, as recordChange uses: the feed's settle window is measured on it.
  const now = new Date();
  const firstId = await insertMany(
    t,
    "sync_changes",
    ["shop_id", "job_id", "entity", "entity_id", "device_id", "created_at"],
    changes.map((c) => [c.shopId, c.jobId, c.entity, String(c.entityId), c.deviceId ?? null, now]),
  );
  // One multi-row INSERT takes consecutive auto-increment ids (InnoDB, "simple insert").
  return String(firstId + changes.length - 1);
}
