import {
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import { datetime, enumOf, intId, modelOptions, ref, str, text } from "./columns";
import { DISPOSITIONS, type Disposition } from "@/lib/schemas/enums";
import type { Flag } from "./flag";
import type { User } from "./user";

/** One decision about a flag, with who, when and why. History: rows are only ever added. */
export class FlagDisposition extends Model<InferAttributes<FlagDisposition>, InferCreationAttributes<FlagDisposition>> {
  declare id: CreationOptional<number>;
  declare flagId: number;
  declare disposition: Disposition;
  declare operation: CreationOptional<string | null>;
  declare reason: CreationOptional<string | null>;
  declare userId: number;
  declare createdAt: CreationOptional<Date>;

  declare flag?: NonAttribute<Flag>;
  declare user?: NonAttribute<User>;
}

export function initFlagDisposition(sequelize: Sequelize): void {
  FlagDisposition.init(
    {
      id: intId(),
      flagId: ref(),
      disposition: enumOf(DISPOSITIONS),
      operation: str(120, true),
      reason: text(),
      userId: ref(),
      createdAt: datetime(false),
    },
    modelOptions(sequelize, "flag_dispositions", "created"),
  );
}
