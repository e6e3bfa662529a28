import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type ModelAttributeColumnOptions,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import { bool, datetime, decimal, enumOf, modelOptions, ref, stamps, str, uuidId } from "./columns";
import { ENTRY_MODES, VERDICTS, type EntryMode, type Verdict } from "@/lib/domain";
import { READING_COLUMNS, READING_FIELDS, type ReadingField, type StoredReading } from "@/lib/schemas/readings";
import type { Instrument } from "./instrument";
import type { Job } from "./job";
import type { User } from "./user";

/**
 * One bench reading. The id is the tablet's UUID (no default), so a resent batch is an upsert.
 * Corrections are new readings that point at the old one through `supersedes`. The fields are
 * StoredReading's (lib/schemas/readings.ts), which the raw SQL of the sync path shares; `implements`
 * keeps the two in step.
 */
export class Reading
  extends Model<InferAttributes<Reading>, InferCreationAttributes<Reading>>
  implements StoredReading
{
  declare id: string;
  declare shopId: number;
  declare jobId: number;
  declare stationId: string;
  declare characteristic: string;
  /** mm for lengths, N·m for torque; null only when skipped. */
  declare valueCanonical: CreationOptional<number | null>;
  /** The figure as entered, in `unit`. */
  declare value: CreationOptional<number | null>;
  declare unit: string;
  declare entryMode: CreationOptional<EntryMode>;
  /** Dial mode: the size the gauge was zeroed on, and the dial's reading, in `unit`. */
  declare dialSetting: CreationOptional<number | null>;
  declare dialDeviation: CreationOptional<number | null>;
  declare instrumentId: CreationOptional<number | null>;
  declare partTempC: CreationOptional<number | null>;
  declare gaugeTempC: CreationOptional<number | null>;
  declare lubricant: CreationOptional<string | null>;
  declare skipped: CreationOptional<boolean>;
  declare skipReason: CreationOptional<string | null>;
  declare note: CreationOptional<string | null>;
  declare takenBy: number;
  /** The tablet's clock. */
  declare takenAt: Date;
  /** The server's clock. */
  declare receivedAt: CreationOptional<Date>;
  declare deviceId: string;
  /** The reading this one corrects. */
  declare supersedes: CreationOptional<string | null>;
  /** Null when skipped. */
  declare verdict: CreationOptional<Verdict | null>;
  /** e.g. 'gauge_past_due'. */
  declare verdictNote: CreationOptional<string | null>;
  /** The limits as evaluated, and the deviation from nominal, in `unit`. */
  declare limitMin: CreationOptional<number | null>;
  declare limitMax: CreationOptional<number | null>;
  declare deviation: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare job?: NonAttribute<Job>;
  declare instrument?: NonAttribute<Instrument | null>;
  declare taker?: NonAttribute<User>;
  declare supersededReading?: NonAttribute<Reading | null>;
  declare corrections?: NonAttribute<Reading[]>;
}

export function initReading(sequelize: Sequelize): void {
  const attributes: Record<ReadingField, ModelAttributeColumnOptions> = {
    id: uuidId(),
    shopId: ref(),
    jobId: ref(),
    stationId: str(64),
    characteristic: str(48),
    valueCanonical: decimal("valueCanonical", 14, 6),
    value: decimal("value", 14, 6),
    unit: str(8),
    entryMode: enumOf(ENTRY_MODES, false, "direct"),
    dialSetting: decimal("dialSetting", 14, 6),
    dialDeviation: decimal("dialDeviation", 14, 6),
    instrumentId: ref(true),
    partTempC: decimal("partTempC", 6, 2),
    gaugeTempC: decimal("gaugeTempC", 6, 2),
    lubricant: str(64, true),
    skipped: bool(false),
    skipReason: str(255, true),
    note: str(500, true),
    takenBy: ref(),
    takenAt: datetime(false),
    receivedAt: datetime(false, true),
    deviceId: str(64),
    supersedes: ref(true, DataTypes.CHAR(36)),
    verdict: enumOf(VERDICTS, true),
    verdictNote: str(64, true),
    limitMin: decimal("limitMin", 14, 6),
    limitMax: decimal("limitMax", 14, 6),
    deviation: decimal("deviation", 14, 6),
  };
  // Every column named by the shared map, not by `underscored`, so the raw SQL reads the same ones.
  const mapped = Object.fromEntries(
    READING_FIELDS.map((k) => [k, { ...attributes[k], field: READING_COLUMNS[k] }]),
  ) as typeof attributes;
  Reading.init({ ...mapped, ...stamps() }, modelOptions(sequelize, "readings", "both"));
}
