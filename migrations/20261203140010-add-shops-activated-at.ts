// A shop started from the public page is not usable until its first admin opens the e-mailed
// link: activated_at stays empty until then and sign-in refuses its people. Shops that exist
// already (the demo, any made by hand) count as activated when they were created, and a row
// inserted without the column is open at once: only the public sign-up writes NULL on purpose.
import { DataTypes } from "sequelize";
import type { MigrationParams } from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.addColumn("shops", "activated_at", {
    type: DataTypes.DATE(3),
    allowNull: true,
    defaultValue: qi.sequelize.literal("CURRENT_TIMESTAMP(3)"),
  });
  await qi.sequelize.query("UPDATE shops SET activated_at = created_at");
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.query("ALTER TABLE shops DROP COLUMN activated_at");
}
