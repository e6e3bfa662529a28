// A gauge's measuring range (what it can read, in its own unit: a 20–150 lbf·ft torque wrench, a
// 4–5 in micrometer), so a reading whose value the gauge cannot hold is refused. Gauges registered
// before keep none until the admin enters it.
import { decimal, type MigrationParams } from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.addColumn("instruments", "range_min", decimal(12, 6));
  await qi.addColumn("instruments", "range_max", decimal(12, 6));
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  // Plain SQL: QueryInterface.removeColumn first runs an untyped raw SELECT for foreign keys, which
  // Sequelize 6 cannot read back from mariadb 3.x ("Cannot delete property 'meta'").
  await qi.sequelize.query("ALTER TABLE instruments DROP COLUMN range_max, DROP COLUMN range_min");
}
