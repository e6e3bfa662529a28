import {
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import { bigId, datetime, json, modelOptions, ref, str } from "./columns";
import type { JsonValue } from "@/lib/schemas/json";
import type { User } from "./user";

/**
 * One entry of the audit trail. Append-only: database triggers refuse UPDATE and DELETE, so
 * create() is the only write that succeeds.
 */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare shopId: number;
  /** Null for actions the system takes on its own. */
  declare userId: CreationOptional<number | null>;
  /** e.g. 'reading.create', 'flag.dispose', 'spec.edit', 'release.sign', 'release.void'. */
  declare action: string;
  declare entityType: string;
  declare entityId: string;
  declare before: CreationOptional<JsonValue | null>;
  declare after: CreationOptional<JsonValue | null>;
  declare createdAt: CreationOptional<Date>;

  declare user?: NonAttribute<User | null>;
}

export function initAuditEvent(sequelize: Sequelize): void {
  AuditEvent.init(
    {
      id: bigId("id"),
      shopId: ref(),
      userId: ref(true),
      action: str(64),
      entityType: str(32),
      entityId: str(64),
      before: json(true),
      after: json(true),
      createdAt: datetime(false),
    },
    modelOptions(sequelize, "audit_events", "created"),
  );
}
