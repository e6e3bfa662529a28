import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import { bool, dateOnly, decimal, intId, modelOptions, ref, stamps, str } from "./columns";
import type { Attachment } from "./attachment";

/** A gauge: resolution and expanded uncertainty U (at coverageK, normally 2) are in `unit`. */
export class Instrument extends Model<InferAttributes<Instrument>, InferCreationAttributes<Instrument>> {
  declare id: CreationOptional<number>;
  declare shopId: number;
  /** 'outside_mic', 'bore_gauge_dial', 'bore_gauge_digital', 'dial_indicator', 'depth_mic', ... */
  declare kind: string;
  declare label: string;
  declare serial: string;
  declare unit: string;
  declare resolution: number;
  declare expandedU: number;
  /** The measuring range in `unit`; null on a gauge registered before ranges were kept. */
  declare rangeMin: CreationOptional<number | null>;
  declare rangeMax: CreationOptional<number | null>;
  declare coverageK: CreationOptional<number>;
  /** 'YYYY-MM-DD'. */
  declare calibratedOn: CreationOptional<string | null>;
  /** 'YYYY-MM-DD'. */
  declare calibrationDue: CreationOptional<string | null>;
  /** Dial bore gauge sign convention: true when a plus reading means a smaller bore. */
  declare dialPlusMeansSmaller: CreationOptional<boolean>;
  declare active: CreationOptional<boolean>;
  /** The setting master a repeatability study measures: its name, size and expanded U (k = 2), in `unit`. */
  declare masterLabel: CreationOptional<string | null>;
  declare masterSize: CreationOptional<number | null>;
  declare masterU: CreationOptional<number | null>;
  declare certificateAttachmentId: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare certificate?: NonAttribute<Attachment | null>;
}

export function initInstrument(sequelize: Sequelize): void {
  Instrument.init(
    {
      id: intId(),
      shopId: ref(),
      kind: str(32),
      label: str(120),
      serial: str(64),
      unit: str(8),
      resolution: decimal("resolution", 12, 6, false),
      expandedU: { ...decimal("expandedU", 12, 6, false), field: "expanded_u" },
      rangeMin: { ...decimal("rangeMin", 12, 6), field: "range_min" },
      rangeMax: { ...decimal("rangeMax", 12, 6), field: "range_max" },
      coverageK: { ...decimal("coverageK", 4, 2, false), field: "coverage_k", defaultValue: 2 },
      calibratedOn: dateOnly(),
      calibrationDue: dateOnly(),
      dialPlusMeansSmaller: bool(true),
      active: bool(true),
      masterLabel: str(120, true),
      masterSize: decimal("masterSize", 12, 6),
      masterU: { ...decimal("masterU", 12, 6), field: "master_u" },
      certificateAttachmentId: ref(true, DataTypes.CHAR(36)),
      ...stamps(),
    },
    modelOptions(sequelize, "instruments", "both"),
  );
}
