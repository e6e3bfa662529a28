import "server-only";
import type { Transaction } from "sequelize";
import { AuditEvent, SyncChange, type SyncEntity } from "@/models";
import type { AuditInput } from "./audit";
import { getSequelize } from "./db";

// recordAudit and recordChange for many rows at once: the same rows, written by one multi-row
// INSERT each, inside the caller's transaction. A batch of 100 readings would otherwise cost
// 200 round trips to the database.

const plainJson = (v: unknown) => (v === undefined ? null : JSON.parse(JSON.stringify(v)));

export async function recordAudits(t: Transaction, events: AuditInput[]): Promise<void> {
  if (events.length === 0) return;
  getSequelize();
  await AuditEvent.bulkCreate(
    events.map((e) => ({
      shopId: e.shopId, userId: e.userId, action: e.action, entityType: e.entityType, entityId: String(e.entityId),
      before: plainJson(e.before), after: plainJson(e.after),
    })),
    { transaction: t, returning: false, hooks: false, validate: false },
  );
}

export type ChangeInput = { shopId: number; jobId: number; entity: SyncEntity; entityId: string | number; deviceId?: string | null };

export async function recordChanges(t: Transaction, changes: ChangeInput[]): Promise<void> {
  if (changes.length === 0) return;
  getSequelize();
  await SyncChange.bulkCreate(
    changes.map((c) => ({ shopId: c.shopId, jobId: c.jobId, entity: c.entity, entityId: String(c.entityId), deviceId: c.deviceId ?? null })),
    { transaction: t, returning: false, hooks: false, validate: false },
  );
}
