import {
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import { bool, datetime, enumOf, int, intId, modelOptions, ref, stamps, str } from "./columns";
import { ROLES, type Role } from "@/lib/schemas/enums";
import type { Shop } from "./shop";

/** A person who signs in. E-mail is unique per shop (case-insensitive by collation). */
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare shopId: number;
  declare name: string;
  declare email: string;
  declare passwordHash: string;
  declare role: Role;
  declare active: CreationOptional<boolean>;
  declare failedAttempts: CreationOptional<number>;
  declare lockedUntil: CreationOptional<Date | null>;
  declare lastSignInAt: CreationOptional<Date | null>;
  /** Set with a temporary password from an admin; the person must choose their own before working. */
  declare mustChangePassword: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare shop?: NonAttribute<Shop>;
}

export function initUser(sequelize: Sequelize): void {
  User.init(
    {
      id: intId(),
      shopId: ref(),
      name: str(120),
      email: str(255),
      passwordHash: str(255),
      role: enumOf(ROLES),
      active: bool(true),
      failedAttempts: int(0),
      lockedUntil: datetime(true),
      lastSignInAt: datetime(true),
      mustChangePassword: bool(false),
      ...stamps(),
    },
    modelOptions(sequelize, "users", "both"),
  );
}
