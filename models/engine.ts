import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import { decimal, enumOf, intId, modelOptions, ref, stamps, str } from "./columns";
import { ENGINE_LAYOUTS, type EngineLayout } from "@/lib/domain";
import { FUELS, UNIT_SYSTEMS, type Fuel, type UnitSystem } from "@/lib/schemas/enums";
import type { Customer } from "./customer";

/** The engine a customer brought in. Nominal bore and stroke are in the engine's unitSystem. */
export class Engine extends Model<InferAttributes<Engine>, InferCreationAttributes<Engine>> {
  declare id: CreationOptional<number>;
  declare shopId: number;
  declare customerId: number;
  declare description: string;
  declare cylinders: number;
  declare layout: EngineLayout;
  declare mains: number;
  declare valvesPerCylinder: CreationOptional<number>;
  declare ringsPerPiston: CreationOptional<number>;
  declare boltsPerRod: CreationOptional<number>;
  declare unitSystem: UnitSystem;
  declare nominalBore: number;
  declare nominalStroke: number;
  /** Standard (design) journal sizes, when known; a job's finished sizes are judged as over or under them. */
  declare nominalMainJournal: CreationOptional<number | null>;
  declare nominalRodJournal: CreationOptional<number | null>;
  /** e.g. 'grey_cast_iron', 'cgi', 'aluminium'. */
  declare blockMaterial: string;
  declare headMaterial: CreationOptional<string | null>;
  declare pistonMaterial: CreationOptional<string | null>;
  declare blockSerial: CreationOptional<string | null>;
  declare crankSerial: CreationOptional<string | null>;
  declare headSerials: CreationOptional<string | null>;
  declare fuel: CreationOptional<Fuel | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare customer?: NonAttribute<Customer>;
}

function count(defaultValue?: number) {
  return {
    type: DataTypes.TINYINT.UNSIGNED,
    allowNull: false,
    ...(defaultValue === undefined ? {} : { defaultValue }),
  };
}

export function initEngine(sequelize: Sequelize): void {
  Engine.init(
    {
      id: intId(),
      shopId: ref(),
      customerId: ref(),
      description: str(255),
      cylinders: count(),
      layout: enumOf(ENGINE_LAYOUTS),
      mains: count(),
      valvesPerCylinder: count(2),
      ringsPerPiston: count(3),
      boltsPerRod: count(2),
      unitSystem: enumOf(UNIT_SYSTEMS),
      nominalBore: decimal("nominalBore", 10, 4, false),
      nominalStroke: decimal("nominalStroke", 10, 4, false),
      nominalMainJournal: decimal("nominalMainJournal", 10, 4),
      nominalRodJournal: decimal("nominalRodJournal", 10, 4),
      blockMaterial: str(32),
      headMaterial: str(32, true),
      pistonMaterial: str(32, true),
      blockSerial: str(64, true),
      crankSerial: str(64, true),
      headSerials: str(160, true),
      fuel: enumOf(FUELS, true),
      ...stamps(),
    },
    modelOptions(sequelize, "engines", "both"),
  );
}
