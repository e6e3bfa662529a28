import {
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import { datetime, decimal, enumOf, int, intId, modelOptions, stamps, str, text } from "./columns";
import type { User } from "./user";
import { GUARD_BAND_POLICIES, UNIT_SYSTEMS, type GuardBandPolicy, type UnitSystem } from "@/lib/schemas/enums";

/** A tenant: one machine shop. Every other row belongs to exactly one shop. */
export class Shop extends Model<InferAttributes<Shop>, InferCreationAttributes<Shop>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare slug: string;
  declare unitSystem: CreationOptional<UnitSystem>;
  declare guardBandPolicy: CreationOptional<GuardBandPolicy>;
  declare email: CreationOptional<string | null>;
  declare phone: CreationOptional<string | null>;
  declare address: CreationOptional<string | null>;
  /**
   * Empty while a shop started from the public page waits for its admin to confirm the e-mail; a
   * shop made any other way (the command, the demo, tests) is open from the start.
   */
  declare activatedAt: CreationOptional<Date | null>;
  /** Gauge study thresholds (defaults: common practice), applied to studies saved after a change. */
  declare studyMinCg: CreationOptional<number>;
  declare studyMinCgk: CreationOptional<number>;
  declare studyMaxResolutionPct: CreationOptional<number>;
  declare studyMaxGrrPct: CreationOptional<number>;
  declare studyValidMonths: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare users?: NonAttribute<User[]>;
}

export function initShop(sequelize: Sequelize): void {
  Shop.init(
    {
      id: intId(),
      name: str(120),
      slug: str(64),
      unitSystem: enumOf(UNIT_SYSTEMS, false, "in"),
      guardBandPolicy: enumOf(GUARD_BAND_POLICIES, false, "shrink_by_u"),
      email: str(255, true),
      phone: str(40, true),
      address: text(),
      activatedAt: datetime(true, true),
      studyMinCg: { ...decimal("studyMinCg", 4, 2, false), defaultValue: 1.33 },
      studyMinCgk: { ...decimal("studyMinCgk", 4, 2, false), defaultValue: 1.33 },
      studyMaxResolutionPct: { ...decimal("studyMaxResolutionPct", 5, 2, false), defaultValue: 5 },
      studyMaxGrrPct: { ...decimal("studyMaxGrrPct", 5, 2, false), defaultValue: 30 },
      studyValidMonths: int(12),
      ...stamps(),
    },
    modelOptions(sequelize, "shops", "both"),
  );
}
