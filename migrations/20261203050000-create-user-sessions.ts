// One row per sign-in. The sealed cookie names its row, and a request is signed in only while the
// row has not ended: signing out, signing in over someone else on the same device, a password reset,
// a role change or a deactivation end rows on the server, so a copied or left-behind cookie is refused.
import { DataTypes } from "sequelize";
import { TABLE_OPTIONS, createdAt, enumOf, fk, type MigrationParams } from "./column-helpers";

// As lib/schemas/enums.ts had them when this shipped (a migration is history: no import).
const END_REASONS = ["signed_out", "replaced", "password_reset", "role_changed", "deactivated"];

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "user_sessions",
    {
      id: { type: DataTypes.CHAR(32), primaryKey: true, allowNull: false },
      user_id: fk("users", "CASCADE"),
      shop_id: fk("shops", "CASCADE"),
      created_at: createdAt(),
      ended_at: { type: DataTypes.DATE(3), allowNull: true },
      ended_reason: enumOf(END_REASONS, undefined, true),
    },
    TABLE_OPTIONS,
  );
  // Ending every session of one person, and pruning their old rows at sign-in.
  await qi.addIndex("user_sessions", ["user_id", "ended_at"], { name: "user_sessions_user_ended" });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable("user_sessions");
}
