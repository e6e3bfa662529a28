// users.must_change_password: set when an admin gives someone a temporary password, cleared when
// they choose their own; until then the app sends them to the change screen and the API refuses
// other work. user_sessions.ended_reason learns why a person's own action ended a sign-in.
import { DataTypes } from "sequelize";
import { enumOf, type MigrationParams } from "./column-helpers";

// As lib/schemas/enums.ts had them when this shipped (a migration is history: no import).
const BEFORE = ["signed_out", "replaced", "password_reset", "role_changed", "deactivated"];
const AFTER = [...BEFORE, "password_changed", "signed_out_everywhere"];

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.addColumn("users", "must_change_password", {
    type: DataTypes.BOOLEAN,
    allowNull: false,
    defaultValue: false,
  });
  await qi.changeColumn("user_sessions", "ended_reason", enumOf(AFTER, undefined, true));
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  // The older list has no word for these; both were a sign-out.
  await qi.sequelize.query(
    "UPDATE user_sessions SET ended_reason = 'signed_out' " +
      "WHERE ended_reason IN ('password_changed', 'signed_out_everywhere')",
  );
  await qi.changeColumn("user_sessions", "ended_reason", enumOf(BEFORE, undefined, true));
  // Plain SQL, as in 20261202000100 (QueryInterface.removeColumn trips over mariadb 3.x).
  await qi.sequelize.query("ALTER TABLE users DROP COLUMN must_change_password");
}
