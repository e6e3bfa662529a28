import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import { datetime, int, modelOptions } from "./columns";

/**
 * Failed sign-in counter for one key ("email:ann@x.test", "ip:10.0.0.5"). Kept in the database,
 * not in memory, so every app instance behind a load balancer sees the same count.
 */
export class AuthThrottle extends Model<InferAttributes<AuthThrottle>, InferCreationAttributes<AuthThrottle>> {
  declare throttleKey: string;
  declare failures: CreationOptional<number>;
  declare windowStartedAt: Date;
  declare lockedUntil: CreationOptional<Date | null>;
}

export function initAuthThrottle(sequelize: Sequelize): void {
  AuthThrottle.init(
    {
      throttleKey: { type: DataTypes.STRING(191), primaryKey: true, allowNull: false },
      failures: int(0),
      windowStartedAt: datetime(false),
      lockedUntil: datetime(true),
    },
    modelOptions(sequelize, "auth_throttle", "none"),
  );
}
