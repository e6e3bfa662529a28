import { Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";
import type { Sequelize } from "sequelize";
import { bool, decimal, intId, modelOptions, ref, stamps, str } from "./columns";

/**
 * One bearing point of a job ("main/3", "rod/5"): its housing bore measured without shells, and the
 * halves chosen for it with the clearance they were predicted to give.
 */
export class BearingPoint extends Model<InferAttributes<BearingPoint>, InferCreationAttributes<BearingPoint>> {
  declare id: CreationOptional<number>;
  declare shopId: number;
  declare jobId: number;
  declare point: string;
  /** In the job's length unit. */
  declare housingBore: CreationOptional<number | null>;
  declare housingGaugeId: CreationOptional<number | null>;
  /** The main that takes the thrust shells. */
  declare thrust: CreationOptional<boolean>;
  /** Factory codes stamped on the block or rod and on the crank, for a grade table. */
  declare housingCode: CreationOptional<string | null>;
  declare journalCode: CreationOptional<string | null>;
  declare upperShellId: CreationOptional<number | null>;
  declare lowerShellId: CreationOptional<number | null>;
  declare predictedClearance: CreationOptional<number | null>;
  /** Expanded uncertainty (k = 2) of the prediction. */
  declare predictedU: CreationOptional<number | null>;
  /** The lead changed the selection's halves by hand. */
  declare byHand: CreationOptional<boolean>;
  declare chosenBy: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initBearingPoint(sequelize: Sequelize): void {
  BearingPoint.init(
    {
      id: intId(),
      shopId: ref(),
      jobId: ref(),
      point: str(16),
      housingBore: decimal("housingBore", 10, 6),
      housingGaugeId: ref(true),
      thrust: bool(false),
      housingCode: str(16, true),
      journalCode: str(16, true),
      upperShellId: ref(true),
      lowerShellId: ref(true),
      predictedClearance: decimal("predictedClearance", 10, 6),
      predictedU: decimal("predictedU", 10, 6),
      byHand: bool(false),
      chosenBy: ref(true),
      ...stamps(),
    },
    modelOptions(sequelize, "bearing_points", "both"),
  );
}
