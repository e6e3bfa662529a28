import { Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";
import type { Sequelize } from "sequelize";
import {
  BEARING_ROLES,
  SHELL_STEP_KINDS,
  WALL_SOURCES,
  type BearingRole,
  type ShellStepKind,
  type WallSource,
} from "@/lib/schemas/bearing-enums";
import { LENGTH_UNITS, type LengthUnit } from "@/lib/domain/enums";
import { decimal, enumOf, int, intId, modelOptions, ref, stamps, str } from "./columns";

/** A set of bearing shells on the shelf for one job: one maker's series and size step, counted in halves. */
export class BearingShell extends Model<InferAttributes<BearingShell>, InferCreationAttributes<BearingShell>> {
  declare id: CreationOptional<number>;
  declare shopId: number;
  declare jobId: number;
  /** The shop's own words for the maker's series (free text); halves mix only within one series. */
  declare series: string;
  declare role: BearingRole;
  declare step: ShellStepKind;
  /** How much thicker, thinner (full-set clearance change) or undersize, in `unit`. */
  declare stepAmount: CreationOptional<number | null>;
  /** A graded shell's mark as the maker prints it. */
  declare grade: CreationOptional<string | null>;
  /** Null on a stepped set whose walls the core derives from the series' standard set. */
  declare wallSource: CreationOptional<WallSource | null>;
  /** nominal: one half's wall from the maker's sheet. */
  declare wall: CreationOptional<number | null>;
  /** range: a graded shell's wall range. */
  declare wallMin: CreationOptional<number | null>;
  declare wallMax: CreationOptional<number | null>;
  /** measured: each half position with a ball micrometer (wallGaugeId gives its U). */
  declare wallUpper: CreationOptional<number | null>;
  declare wallLower: CreationOptional<number | null>;
  declare wallGaugeId: CreationOptional<number | null>;
  declare halvesUpper: number;
  declare halvesLower: number;
  declare unit: LengthUnit;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initBearingShell(sequelize: Sequelize): void {
  BearingShell.init(
    {
      id: intId(),
      shopId: ref(),
      jobId: ref(),
      series: str(80),
      role: enumOf(BEARING_ROLES),
      step: enumOf(SHELL_STEP_KINDS),
      stepAmount: decimal("stepAmount", 10, 6),
      grade: str(24, true),
      wallSource: enumOf(WALL_SOURCES, true),
      wall: decimal("wall", 10, 6),
      wallMin: decimal("wallMin", 10, 6),
      wallMax: decimal("wallMax", 10, 6),
      wallUpper: decimal("wallUpper", 10, 6),
      wallLower: decimal("wallLower", 10, 6),
      wallGaugeId: ref(true),
      halvesUpper: int(),
      halvesLower: int(),
      unit: enumOf(LENGTH_UNITS),
      ...stamps(),
    },
    modelOptions(sequelize, "bearing_shells", "both"),
  );
}
