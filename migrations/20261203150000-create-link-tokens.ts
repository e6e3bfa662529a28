// One-time links sent by e-mail (invitations, password resets, e-mail checks). Only a SHA-256 of
// the token is kept: whoever reads this table cannot use a link that is still live.
import { DataTypes } from "sequelize";
import { TABLE_OPTIONS, createdAt, enumOf, fk, intId, type MigrationParams } from "./column-helpers";

// As lib/schemas/enums.ts had them when this shipped (a migration is history: no import).
const PURPOSES = ["verify_email", "set_password", "reset_password"];

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "link_tokens",
    {
      id: intId(),
      token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      purpose: enumOf(PURPOSES),
      user_id: fk("users", "CASCADE"),
      shop_id: fk("shops", "CASCADE"),
      expires_at: { type: DataTypes.DATE(3), allowNull: false },
      used_at: { type: DataTypes.DATE(3), allowNull: true },
      voided_at: { type: DataTypes.DATE(3), allowNull: true },
      created_at: createdAt(),
    },
    TABLE_OPTIONS,
  );
  // Voiding a person's earlier links of one purpose when a new one is sent.
  await qi.addIndex("link_tokens", ["user_id", "purpose", "used_at"], { name: "link_tokens_user_purpose" });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable("link_tokens");
}
