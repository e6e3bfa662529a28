import {
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import { bool, enumOf, int, intId, modelOptions, ref, stamps, str, text } from "./columns";
import { UNIT_SYSTEMS, type UnitSystem } from "@/lib/schemas/enums";
import type { SpecLimit } from "./spec-limit";

/** A shop's spec sheet for one engine kind and build ('street', 'endurance', 'marine', ...). */
export class SpecTemplate extends Model<InferAttributes<SpecTemplate>, InferCreationAttributes<SpecTemplate>> {
  declare id: CreationOptional<number>;
  declare shopId: number;
  declare name: string;
  declare engineKind: string;
  declare buildKind: string;
  declare unitSystem: UnitSystem;
  declare notes: CreationOptional<string | null>;
  declare version: CreationOptional<number>;
  declare archived: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare limits?: NonAttribute<SpecLimit[]>;
}

export function initSpecTemplate(sequelize: Sequelize): void {
  SpecTemplate.init(
    {
      id: intId(),
      shopId: ref(),
      name: str(160),
      engineKind: str(64),
      buildKind: str(32),
      unitSystem: enumOf(UNIT_SYSTEMS),
      notes: text(),
      version: int(1),
      archived: bool(false),
      ...stamps(),
    },
    modelOptions(sequelize, "spec_templates", "both"),
  );
}
