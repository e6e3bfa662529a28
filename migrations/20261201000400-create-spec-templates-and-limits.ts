// A shop's spec sheets: one template per engine kind and build, each with its limits.
import { DataTypes } from "sequelize";
import {
  TABLE_OPTIONS,
  UNIT_SYSTEMS,
  bool,
  enumOf,
  fk,
  intId,
  limitColumns,
  timestamps,
  varchar,
  type MigrationParams,
} from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "spec_templates",
    {
      id: intId(),
      shop_id: fk("shops", "RESTRICT"),
      name: varchar(160),
      engine_kind: varchar(64),
      build_kind: varchar(32),
      unit_system: enumOf(UNIT_SYSTEMS),
      notes: { type: DataTypes.TEXT, allowNull: true },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      archived: bool(false),
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("spec_templates", ["shop_id", "archived", "name"], { name: "spec_templates_shop_archived_name" });

  await qi.createTable(
    "spec_limits",
    {
      id: intId(),
      template_id: fk("spec_templates", "CASCADE"),
      ...limitColumns(),
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("spec_limits", ["template_id", "sort_order"], { name: "spec_limits_template_order" });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable("spec_limits");
  await qi.dropTable("spec_templates");
}
