import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import { datetime, decimal, enumOf, intId, modelOptions, ref, stamps, str, text } from "./columns";
import { VERDICTS, type Verdict } from "@/lib/domain";
import {
  DISPOSITIONS,
  FLAG_REASONS,
  FLAG_STATES,
  type Disposition,
  type FlagReason,
  type FlagState,
} from "@/lib/schemas/enums";
import type { FlagDisposition } from "./flag-disposition";
import type { Job } from "./job";
import type { Reading } from "./reading";
import type { User } from "./user";

/**
 * A value that needs the lead's attention: a raw reading (readingId) or a derived value
 * (derivedKey, e.g. 'main-oil-clearance/main/2'). The latest disposition is kept here for the
 * queue; the full history is in FlagDisposition.
 */
export class Flag extends Model<InferAttributes<Flag>, InferCreationAttributes<Flag>> {
  declare id: CreationOptional<number>;
  declare shopId: number;
  declare jobId: number;
  declare readingId: CreationOptional<string | null>;
  declare derivedKey: CreationOptional<string | null>;
  declare stationId: string;
  declare characteristic: string;
  declare value: number;
  declare unit: string;
  declare limitMin: CreationOptional<number | null>;
  declare limitMax: CreationOptional<number | null>;
  declare deviation: CreationOptional<number | null>;
  declare verdict: Verdict;
  declare reason: FlagReason;
  declare state: CreationOptional<FlagState>;
  declare disposition: CreationOptional<Disposition | null>;
  /** For machine_again: e.g. 'hone', 'grind undersize', 'align-hone'. */
  declare operation: CreationOptional<string | null>;
  declare dispositionReason: CreationOptional<string | null>;
  declare disposedBy: CreationOptional<number | null>;
  declare disposedAt: CreationOptional<Date | null>;
  declare closedAt: CreationOptional<Date | null>;
  declare closedByReadingId: CreationOptional<string | null>;
  /** When the value was judged: its reading's time, or the flag's own for a computed value (a trigger sets it). */
  declare judgedAt: CreationOptional<Date | null>;
  /** The job's code, kept by triggers for the queue's job sort. */
  declare jobCode: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare job?: NonAttribute<Job>;
  declare reading?: NonAttribute<Reading | null>;
  declare closingReading?: NonAttribute<Reading | null>;
  declare disposer?: NonAttribute<User | null>;
  declare dispositions?: NonAttribute<FlagDisposition[]>;
}

export function initFlag(sequelize: Sequelize): void {
  const uuidRef = () => ref(true, DataTypes.CHAR(36));
  Flag.init(
    {
      id: intId(),
      shopId: ref(),
      jobId: ref(),
      readingId: uuidRef(),
      derivedKey: str(96, true),
      stationId: str(64),
      characteristic: str(48),
      value: decimal("value", 14, 6, false),
      unit: str(8),
      limitMin: decimal("limitMin", 14, 6),
      limitMax: decimal("limitMax", 14, 6),
      deviation: decimal("deviation", 14, 6),
      verdict: enumOf(VERDICTS),
      reason: enumOf(FLAG_REASONS),
      state: enumOf(FLAG_STATES, false, "open"),
      disposition: enumOf(DISPOSITIONS, true),
      operation: str(120, true),
      dispositionReason: text(),
      disposedBy: ref(true),
      disposedAt: datetime(true),
      closedAt: datetime(true),
      closedByReadingId: uuidRef(),
      judgedAt: datetime(true),
      jobCode: str(24, true),
      ...stamps(),
    },
    modelOptions(sequelize, "flags", "both"),
  );
}
