import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import { datetime, int, intId, json, modelOptions, ref, stamps, str, text } from "./columns";
import type { JsonValue } from "@/lib/schemas/json";
import type { Job } from "./job";
import type { User } from "./user";

/**
 * An inspector's signed release. `hash` is the hex SHA-256 of the canonical serialisation
 * (version canonicalVersion) of what was released. Reopening voids the row; it is never deleted.
 */
export class Release extends Model<InferAttributes<Release>, InferCreationAttributes<Release>> {
  declare id: CreationOptional<number>;
  declare shopId: number;
  declare jobId: number;
  declare inspectorId: number;
  declare signedName: string;
  declare signedAt: Date;
  declare checklist: JsonValue;
  declare hash: string;
  declare canonicalVersion: number;
  declare voidedAt: CreationOptional<Date | null>;
  declare voidedBy: CreationOptional<number | null>;
  declare voidReason: CreationOptional<string | null>;
  /** The build record rendered once for this release, in object storage, and its SHA-256 (hex). */
  declare recordKey: CreationOptional<string | null>;
  declare recordSha256: CreationOptional<string | null>;
  declare recordBytes: CreationOptional<number | null>;
  declare recordStoredAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare job?: NonAttribute<Job>;
  declare inspector?: NonAttribute<User>;
  declare voider?: NonAttribute<User | null>;
}

export function initRelease(sequelize: Sequelize): void {
  Release.init(
    {
      id: intId(),
      shopId: ref(),
      jobId: ref(),
      inspectorId: ref(),
      signedName: str(160),
      signedAt: datetime(false),
      checklist: json(false),
      hash: { type: DataTypes.CHAR(64), allowNull: false },
      canonicalVersion: int(),
      voidedAt: datetime(true),
      voidedBy: ref(true),
      voidReason: text(),
      recordKey: str(255, true),
      recordSha256: { type: DataTypes.CHAR(64), allowNull: true },
      recordBytes: { type: DataTypes.INTEGER, allowNull: true },
      recordStoredAt: datetime(true),
      ...stamps(),
    },
    modelOptions(sequelize, "releases", "both"),
  );
}
