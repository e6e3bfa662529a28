// releases.record_*: the build record rendered once for a signed release and kept in object
// storage: its key, its SHA-256 (hex) and size, and when it was stored. Empty until it is stored
// (at signing, or by the first reader when storing at signing failed).
import { DataTypes } from "sequelize";
import type { MigrationParams } from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.addColumn("releases", "record_key", { type: DataTypes.STRING(255), allowNull: true });
  await qi.addColumn("releases", "record_sha256", { type: DataTypes.CHAR(64), allowNull: true });
  await qi.addColumn("releases", "record_bytes", { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn("releases", "record_stored_at", { type: DataTypes.DATE(3), allowNull: true });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  // Plain SQL, as in 20261202000100 (QueryInterface.removeColumn trips over mariadb 3.x).
  await qi.sequelize.query(
    "ALTER TABLE releases DROP COLUMN record_key, DROP COLUMN record_sha256, " +
      "DROP COLUMN record_bytes, DROP COLUMN record_stored_at",
  );
}
