// A flag can be raised for the gauge's latest study: failed for the reading's tolerance, or past
// its due date when the reading was taken (readings.verdict_note says the same per reading).
import { enumOf, type MigrationParams } from "./column-helpers";

// As lib/schemas/enums.ts had them when this shipped (a migration is history: no import).
const BEFORE = ["out_of_spec", "marginal", "gauge_past_due"];
const AFTER = [...BEFORE, "gauge_study_failed", "gauge_study_due"];

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.changeColumn("flags", "reason", enumOf(AFTER));
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  // The older set has no word for a study: such flags go back as flags about the gauge.
  await qi.sequelize.query(
    "UPDATE flags SET reason = 'gauge_past_due' WHERE reason IN ('gauge_study_failed', 'gauge_study_due')",
  );
  await qi.changeColumn("flags", "reason", enumOf(BEFORE));
}
