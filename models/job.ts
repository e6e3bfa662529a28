import {
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import { dateOnly, datetime, decimal, enumOf, int, intId, json, modelOptions, ref, stamps, str, text } from "./columns";
import { JOB_STATUSES, type JobStatus } from "@/lib/domain";
import { UNIT_SYSTEMS, type UnitSystem } from "@/lib/schemas/enums";
import type { JsonObject } from "@/lib/schemas/json";
import type { Customer } from "./customer";
import type { Engine } from "./engine";
import type { JobLimit } from "./job-limit";
import type { SpecTemplate } from "./spec-template";

/** One engine job through intake → measuring → review → released → closed. */
export class Job extends Model<InferAttributes<Job>, InferCreationAttributes<Job>> {
  declare id: CreationOptional<number>;
  declare shopId: number;
  declare customerId: number;
  declare engineId: number;
  /** The template the limits were copied from (null once that template is deleted). */
  declare templateId: CreationOptional<number | null>;
  /** Unique per shop, e.g. 'TW-1041'. */
  declare code: string;
  declare title: string;
  declare unitSystem: UnitSystem;
  declare status: CreationOptional<JobStatus>;
  /** 'YYYY-MM-DD'. */
  declare dueDate: CreationOptional<string | null>;
  declare notes: CreationOptional<string | null>;
  declare buildPlan: CreationOptional<JsonObject | null>;
  /** The sizes the job machines to, in its unitSystem (job-size limits follow them); null when not stated. */
  declare finishedBore: CreationOptional<number | null>;
  declare finishedMainJournal: CreationOptional<number | null>;
  declare finishedRodJournal: CreationOptional<number | null>;
  /** Bumped on every edit of the job's limits. */
  declare specRevision: CreationOptional<number>;
  /** Set while a release stands; readings for a locked job are refused. */
  declare lockedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare customer?: NonAttribute<Customer>;
  declare engine?: NonAttribute<Engine>;
  declare template?: NonAttribute<SpecTemplate | null>;
  declare limits?: NonAttribute<JobLimit[]>;
}

export function initJob(sequelize: Sequelize): void {
  Job.init(
    {
      id: intId(),
      shopId: ref(),
      customerId: ref(),
      engineId: ref(),
      templateId: ref(true),
      code: str(24),
      title: str(160),
      unitSystem: enumOf(UNIT_SYSTEMS),
      status: enumOf(JOB_STATUSES, false, "intake"),
      dueDate: dateOnly(),
      notes: text(),
      buildPlan: json(true),
      finishedBore: decimal("finishedBore", 10, 5),
      finishedMainJournal: decimal("finishedMainJournal", 10, 5),
      finishedRodJournal: decimal("finishedRodJournal", 10, 5),
      specRevision: int(1),
      lockedAt: datetime(true),
      ...stamps(),
    },
    modelOptions(sequelize, "jobs", "both"),
  );
}
