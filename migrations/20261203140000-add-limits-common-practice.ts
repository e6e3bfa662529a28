// A starter spec sheet's figures are typical values, not any maker's: each of its limits (and the
// job limits copied from it) carries common_practice = 1, so every screen and the build record can
// say "replace with the engine or part maker's specification" until the lead edits that limit.
import { bool, type MigrationParams } from "./column-helpers";

const LIMIT_TABLES = ["spec_limits", "job_limits"] as const;

export async function up({ context: qi }: MigrationParams): Promise<void> {
  for (const table of LIMIT_TABLES) await qi.addColumn(table, "common_practice", bool(false));
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  // Plain SQL, as in 20261203030000 (QueryInterface.removeColumn trips over mariadb 3.x).
  for (const table of LIMIT_TABLES) await qi.sequelize.query(`ALTER TABLE ${table} DROP COLUMN common_practice`);
}
