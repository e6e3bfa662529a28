// The gauge's (and setting master's) temperature of a reading: with the part temperature it lets the
// core correct a length to 20 °C for both expansions, and re-evaluation must see the same figure.
import { decimal, type MigrationParams } from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.addColumn("readings", "gauge_temp_c", decimal(6, 2));
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  // Plain SQL: QueryInterface.removeColumn first runs an untyped raw SELECT for foreign keys, which
  // Sequelize 6 cannot read back from mariadb 3.x ("Cannot delete property 'meta'").
  await qi.sequelize.query("ALTER TABLE readings DROP COLUMN gauge_temp_c");
}
