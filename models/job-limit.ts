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
import type { Job } from "./job";

/**
 * One limit of a job's own snapshot, copied from its template when the job was created and edited
 * only through the job, so a later template edit never changes a job.
 */
export class JobLimit extends Model<InferAttributes<JobLimit>, InferCreationAttributes<JobLimit>> {
  declare id: CreationOptional<number>;
  declare jobId: number;
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

  declare job?: NonAttribute<Job>;
}

export function initJobLimit(sequelize: Sequelize): void {
  JobLimit.init(
    { id: intId(), jobId: ref(), ...limitAttributes(), ...stamps() },
    modelOptions(sequelize, "job_limits", "both"),
  );
}
