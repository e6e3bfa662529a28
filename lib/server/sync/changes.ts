import "server-only";
import type { Transaction } from "sequelize";
import { SyncChange } from "@/models";
import type { SyncEntity } from "@/lib/schemas/enums";

// The change feed behind GET /api/sync?since=CURSOR: one row per changed reading, flag, job
// limit set or job, written in the transaction of the change.
export async function recordChange(
  t: Transaction | null,
  c: { shopId: number; jobId: number; entity: SyncEntity; entityId: string | number; deviceId?: string | null },
): Promise<void> {
  await SyncChange.create(
    { shopId: c.shopId, jobId: c.jobId, entity: c.entity, entityId: String(c.entityId), deviceId: c.deviceId ?? null },
    { transaction: t ?? undefined },
  );
}
