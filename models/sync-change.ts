import {
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import { bigId, datetime, enumOf, modelOptions, ref, str } from "./columns";
import { SYNC_ENTITIES, type SyncEntity } from "@/lib/schemas/enums";

/** One entry of the change feed; `id` is the cursor of GET /api/sync?since=CURSOR. */
export class SyncChange extends Model<InferAttributes<SyncChange>, InferCreationAttributes<SyncChange>> {
  declare id: CreationOptional<number>;
  declare shopId: number;
  declare jobId: number;
  declare entity: SyncEntity;
  declare entityId: string;
  /** The device whose upload caused the change; null for office edits. */
  declare deviceId: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
}

export function initSyncChange(sequelize: Sequelize): void {
  SyncChange.init(
    {
      id: bigId("id"),
      shopId: ref(),
      jobId: ref(),
      entity: enumOf(SYNC_ENTITIES),
      entityId: str(64),
      deviceId: str(64, true),
      createdAt: datetime(false),
    },
    modelOptions(sequelize, "sync_changes", "created"),
  );
}
