import {
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import type { JsonObject, JsonValue } from "@/lib/schemas/json";
import { STUDY_KINDS, type StudyKind } from "@/lib/schemas/enums";
import { bool, dateOnly, datetime, decimal, enumOf, intId, json, modelOptions, ref, str } from "./columns";
import type { User } from "./user";

/**
 * A gauge capability study as taken: a type 1 study of a reference or an R&R study. Never changed
 * once saved; figures are in `unit`, the gauge's when it was taken.
 */
export class GaugeStudy extends Model<InferAttributes<GaugeStudy>, InferCreationAttributes<GaugeStudy>> {
  declare id: CreationOptional<number>;
  declare shopId: number;
  declare instrumentId: number;
  declare kind: StudyKind;
  declare performedBy: number;
  /** 'YYYY-MM-DD'. */
  declare performedOn: string;
  declare dueOn: string;
  declare unit: string;
  declare resolution: number;
  declare referenceValue: CreationOptional<number | null>;
  declare referenceU: CreationOptional<number | null>;
  declare referenceK: CreationOptional<number | null>;
  declare tolerance: CreationOptional<number | null>;
  declare measurements: JsonValue[];
  declare appraisers: CreationOptional<string[] | null>;
  declare mean: CreationOptional<number | null>;
  declare repeatSd: number;
  declare bias: number;
  declare grrSd: CreationOptional<number | null>;
  declare passed: boolean;
  declare thresholds: JsonObject;
  declare result: JsonObject;
  declare createdAt: CreationOptional<Date>;

  declare performer?: NonAttribute<User | null>;
}

export function initGaugeStudy(sequelize: Sequelize): void {
  GaugeStudy.init(
    {
      id: intId(),
      shopId: ref(),
      instrumentId: ref(),
      kind: enumOf(STUDY_KINDS),
      performedBy: ref(),
      performedOn: { ...dateOnly(), allowNull: false },
      dueOn: { ...dateOnly(), allowNull: false },
      unit: str(8),
      resolution: decimal("resolution", 12, 6, false),
      referenceValue: decimal("referenceValue", 14, 6),
      referenceU: { ...decimal("referenceU", 12, 6), field: "reference_u" },
      referenceK: { ...decimal("referenceK", 4, 2), field: "reference_k" },
      tolerance: decimal("tolerance", 14, 6),
      measurements: json(false),
      appraisers: json(true),
      mean: decimal("mean", 14, 6),
      repeatSd: decimal("repeatSd", 14, 8, false),
      bias: decimal("bias", 14, 8, false),
      grrSd: decimal("grrSd", 14, 8),
      passed: bool(false),
      thresholds: json(false),
      result: json(false),
      createdAt: datetime(false),
    },
    modelOptions(sequelize, "gauge_studies", "created"),
  );
}
