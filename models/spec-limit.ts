import {
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import { intId, modelOptions, ref, stamps } from "./columns";
import type { LimitType } from "@/lib/domain";
import { limitAttributes } from "./limit-attributes";
import type { SpecTemplate } from "./spec-template";

/** One limit of a spec template. */
export class SpecLimit extends Model<InferAttributes<SpecLimit>, InferCreationAttributes<SpecLimit>> {
  declare id: CreationOptional<number>;
  declare templateId: number;
  declare characteristic: string;
  /** Which stations the limit applies to: a pattern over the core's station ids. */
  declare stationPattern: string;
  declare limitType: LimitType;
  /** 'in', 'mm', 'lbf_ft' or 'nm'. */
  declare unit: string;
  declare min: CreationOptional<number | null>;
  declare max: CreationOptional<number | null>;
  declare nominal: CreationOptional<number | null>;
  declare tolPlus: CreationOptional<number | null>;
  declare tolMinus: CreationOptional<number | null>;
  declare perInchMin: CreationOptional<number | null>;
  declare perInchMax: CreationOptional<number | null>;
  declare isoClass: CreationOptional<string | null>;
  declare required: CreationOptional<boolean>;
  declare gaugeKind: CreationOptional<string | null>;
  declare label: CreationOptional<string | null>;
  declare sortOrder: CreationOptional<number>;
  declare commonPractice: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare template?: NonAttribute<SpecTemplate>;
}

export function initSpecLimit(sequelize: Sequelize): void {
  SpecLimit.init(
    { id: intId(), templateId: ref(), ...limitAttributes(), ...stamps() },
    modelOptions(sequelize, "spec_limits", "both"),
  );
}
