import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";
import type { Sequelize } from "sequelize";
import { SESSION_END_REASONS, type SessionEndReason } from "@/lib/schemas/enums";
import { datetime, enumOf, modelOptions, ref } from "./columns";

/** One sign-in; the sealed cookie names it, and it counts only until it has ended. */
export class UserSession extends Model<InferAttributes<UserSession>, InferCreationAttributes<UserSession>> {
  declare id: string;
  declare userId: number;
  declare shopId: number;
  declare createdAt: CreationOptional<Date>;
  declare endedAt: CreationOptional<Date | null>;
  declare endedReason: CreationOptional<SessionEndReason | null>;
}

export function initUserSession(sequelize: Sequelize): void {
  UserSession.init(
    {
      id: { type: DataTypes.CHAR(32), primaryKey: true, allowNull: false },
      userId: ref(),
      shopId: ref(),
      createdAt: datetime(false),
      endedAt: datetime(true),
      endedReason: enumOf(SESSION_END_REASONS, true),
    },
    modelOptions(sequelize, "user_sessions", "created"),
  );
}
