import {
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import { intId, modelOptions, ref, stamps, str, text } from "./columns";
import type { Engine } from "./engine";
import type { Job } from "./job";

export class Customer extends Model<InferAttributes<Customer>, InferCreationAttributes<Customer>> {
  declare id: CreationOptional<number>;
  declare shopId: number;
  declare name: string;
  declare email: CreationOptional<string | null>;
  declare phone: CreationOptional<string | null>;
  declare notes: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare engines?: NonAttribute<Engine[]>;
  declare jobs?: NonAttribute<Job[]>;
}

export function initCustomer(sequelize: Sequelize): void {
  Customer.init(
    {
      id: intId(),
      shopId: ref(),
      name: str(160),
      email: str(255, true),
      phone: str(40, true),
      notes: text(),
      ...stamps(),
    },
    modelOptions(sequelize, "customers", "both"),
  );
}
