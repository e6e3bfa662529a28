// The shop's customers and the engines they bring in.
import { DataTypes } from "sequelize";
import {
  TABLE_OPTIONS,
  UNIT_SYSTEMS,
  decimal,
  enumOf,
  fk,
  intId,
  timestamps,
  varchar,
  type MigrationParams,
} from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "customers",
    {
      id: intId(),
      shop_id: fk("shops", "RESTRICT"),
      name: varchar(160),
      email: varchar(255, true),
      phone: varchar(40, true),
      notes: { type: DataTypes.TEXT, allowNull: true },
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("customers", ["shop_id", "name"], { name: "customers_shop_name" });

  const smallCount = (defaultValue?: number) => ({
    type: DataTypes.TINYINT.UNSIGNED,
    allowNull: false,
    ...(defaultValue === undefined ? {} : { defaultValue }),
  });
  await qi.createTable(
    "engines",
    {
      id: intId(),
      shop_id: fk("shops", "RESTRICT"),
      customer_id: fk("customers", "RESTRICT"),
      description: varchar(255),
      cylinders: smallCount(),
      layout: enumOf(["inline", "v", "flat"]),
      mains: smallCount(),
      valves_per_cylinder: smallCount(2),
      rings_per_piston: smallCount(3),
      bolts_per_rod: smallCount(2),
      unit_system: enumOf(UNIT_SYSTEMS),
      // In the engine's own unit system (unit_system).
      nominal_bore: decimal(10, 4, false),
      nominal_stroke: decimal(10, 4, false),
      block_material: varchar(32),
      head_material: varchar(32, true),
      piston_material: varchar(32, true),
      block_serial: varchar(64, true),
      crank_serial: varchar(64, true),
      head_serials: varchar(160, true),
      fuel: enumOf(["gasoline", "diesel", "other"], undefined, true),
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable("engines");
  await qi.dropTable("customers");
}
