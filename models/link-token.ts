import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";
import type { Sequelize } from "sequelize";
import { LINK_PURPOSES, type LinkPurpose } from "@/lib/schemas/enums";
import { datetime, enumOf, intId, modelOptions, ref } from "./columns";

/** A one-time link sent by e-mail; only the SHA-256 of its token is kept. */
export class LinkToken extends Model<InferAttributes<LinkToken>, InferCreationAttributes<LinkToken>> {
  declare id: CreationOptional<number>;
  declare tokenHash: string;
  declare purpose: LinkPurpose;
  declare userId: number;
  declare shopId: number;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  /** Set when a newer link of the same purpose was sent to the same person. */
  declare voidedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
}

export function initLinkToken(sequelize: Sequelize): void {
  LinkToken.init(
    {
      id: intId(),
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false },
      purpose: enumOf(LINK_PURPOSES),
      userId: ref(),
      shopId: ref(),
      expiresAt: datetime(false),
      usedAt: datetime(true),
      voidedAt: datetime(true),
      createdAt: datetime(false),
    },
    modelOptions(sequelize, "link_tokens", "created"),
  );
}
