// Tenants, their people, and the sign-in throttle.
import { DataTypes } from "sequelize";
import {
  TABLE_OPTIONS,
  UNIT_SYSTEMS,
  bool,
  enumOf,
  fk,
  intId,
  timestamps,
  varchar,
  type MigrationParams,
} from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "shops",
    {
      id: intId(),
      name: varchar(120),
      slug: varchar(64),
      unit_system: enumOf(UNIT_SYSTEMS, "in"),
      guard_band_policy: enumOf(["shrink_by_u", "none"], "shrink_by_u"),
      email: varchar(255, true),
      phone: varchar(40, true),
      address: { type: DataTypes.TEXT, allowNull: true },
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("shops", ["slug"], { name: "shops_slug_unique", unique: true });

  await qi.createTable(
    "users",
    {
      id: intId(),
      shop_id: fk("shops", "RESTRICT"),
      name: varchar(120),
      email: varchar(255),
      password_hash: varchar(255),
      role: enumOf(["machinist", "lead", "inspector", "admin"]),
      active: bool(true),
      failed_attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      locked_until: { type: DataTypes.DATE(3), allowNull: true },
      last_sign_in_at: { type: DataTypes.DATE(3), allowNull: true },
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
  // Case-insensitive collation: Ann@Shop and ann@shop are one account.
  await qi.addIndex("users", ["shop_id", "email"], { name: "users_shop_email_unique", unique: true });
  // Sign-in looks a user up by e-mail before the shop is known.
  await qi.addIndex("users", ["email"], { name: "users_email" });

  // One row per throttled key ("email:ann@x", "ip:10.0.0.5"), shared by every app instance.
  await qi.createTable(
    "auth_throttle",
    {
      throttle_key: { type: DataTypes.STRING(191), primaryKey: true, allowNull: false },
      failures: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      window_started_at: { type: DataTypes.DATE(3), allowNull: false },
      locked_until: { type: DataTypes.DATE(3), allowNull: true },
    },
    TABLE_OPTIONS,
  );
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable("auth_throttle");
  await qi.dropTable("users");
  await qi.dropTable("shops");
}
