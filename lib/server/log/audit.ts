import "server-only";
import type { Transaction } from "sequelize";
import { AuditEvent } from "@/models";

// Every change is an append-only audit event written in the same transaction as the change
// itself, so the trail can never disagree with the data. The table refuses UPDATE and DELETE.
export type AuditInput = {
  shopId: number;
  userId: number | null;
  action: string;
  entityType: string;
  entityId: string | number;
  before?: unknown;
  after?: unknown;
};

const plain = (v: unknown) => (v === undefined ? null : JSON.parse(JSON.stringify(v)));

export async function recordAudit(t: Transaction | null, e: AuditInput): Promise<void> {
  await AuditEvent.create(
    {
      shopId: e.shopId,
      userId: e.userId,
      action: e.action,
      entityType: e.entityType,
      entityId: String(e.entityId),
      before: plain(e.before),
      after: plain(e.after),
    },
    { transaction: t ?? undefined },
  );
}
