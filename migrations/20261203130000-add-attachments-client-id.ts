// A device's id for a file (its clientId) is kept per shop, apart from the row's own id, which the
// server now makes. A clientId another shop happens to use is then simply not there for this
// shop: the upload is stored as a fresh one and the answer tells nothing of the other shop.
// Files stored before keep their id as their clientId.
import { DataTypes } from "sequelize";
import type { MigrationParams } from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.addColumn("attachments", "client_id", { type: DataTypes.CHAR(36), allowNull: true });
  await qi.sequelize.query("UPDATE attachments SET client_id = id");
  await qi.sequelize.query("ALTER TABLE attachments MODIFY client_id CHAR(36) NOT NULL");
  // client_id first: an index led by shop_id would take over the shop_id foreign key's own index,
  // and down could then not drop it.
  await qi.addIndex("attachments", ["client_id", "shop_id"], {
    name: "attachments_shop_client_unique",
    unique: true,
  });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.removeIndex("attachments", "attachments_shop_client_unique");
  await qi.sequelize.query("ALTER TABLE attachments DROP COLUMN client_id");
}
