// Outgoing mail, written in the same transaction as the change that causes it and sent later,
// so a failing SMTP server never blocks a release. Failures are retried at next_attempt_at.
import { DataTypes } from "sequelize";
import { TABLE_OPTIONS, createdAt, fk, intId, timestamps, varchar, type MigrationParams } from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "mail_outbox",
    {
      id: intId(),
      shop_id: fk("shops", "CASCADE"),
      kind: varchar(32), // 'build_record', 'flag_digest', 'ready_for_release'
      // Optional: one message per key (e.g. 'ready_for_release:job:12:rev:3') even when several
      // app instances notice the same event.
      dedupe_key: varchar(128, true),
      to_address: varchar(255),
      subject: varchar(255),
      payload: { type: DataTypes.JSON, allowNull: false },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      last_error: { type: DataTypes.TEXT, allowNull: true },
      next_attempt_at: createdAt(),
      sent_at: { type: DataTypes.DATE(3), allowNull: true },
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("mail_outbox", ["sent_at", "next_attempt_at"], { name: "mail_outbox_due" });
  await qi.addIndex("mail_outbox", ["dedupe_key"], { name: "mail_outbox_dedupe_unique", unique: true });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable("mail_outbox");
}
