// The change feed's cursor becomes a per-shop sequence that follows commit order.
//
// sync_changes.id comes from auto-increment, handed out at insert, not at commit: a lower id can
// become visible after a higher one (a slow transaction on one node; and on Galera each node hands
// out its own spaced ids, so a later commit on one node often carries a lower id than an earlier
// one on another). A cursor over ids must then wait for a settle window, which no replication lag
// is guaranteed to respect.
//
// sync_changes.seq instead: each row takes the next number of its shop's counter
// (sync_sequences), bumped in the same transaction by the trigger below. The counter row is
// locked until commit on one node, and on a cluster two nodes' bumps of the same row conflict at
// certification (the later one fails with 1213 and its batch runs again); so a transaction can
// only take numbers after every transaction that took lower numbers has committed, and every node
// applies commits in that same order. A reader on any node therefore sees a gap-free prefix of the
// shop's sequence, and "everything after the last seq I saw" never skips or repeats a change.
//
// Old cursors (ids) stay valid: existing rows keep seq = id and every shop's counter starts at the
// highest id, so the first new number of any shop is above any cursor already handed out.
// A trigger, not application code, so no writer of the feed (ingest, edits, releases, a future
// one) can forget to number its rows; a restored row that already has its number keeps it.
import { DataTypes } from "sequelize";
import { TABLE_OPTIONS, fk, type MigrationParams } from "./column-helpers";

const TRIGGERS: [name: string, sql: string][] = [
  [
    "shops_sync_sequence_insert",
    "AFTER INSERT ON shops FOR EACH ROW INSERT IGNORE INTO sync_sequences (shop_id, seq) VALUES (NEW.id, 0)",
  ],
  [
    "sync_changes_seq_insert",
    `BEFORE INSERT ON sync_changes FOR EACH ROW IF NEW.seq = 0 THEN
       INSERT INTO sync_sequences (shop_id, seq) VALUES (NEW.shop_id, 1) ON DUPLICATE KEY UPDATE seq = seq + 1;
       SET NEW.seq = (SELECT seq FROM sync_sequences WHERE shop_id = NEW.shop_id);
     END IF`,
  ],
];

export const SEQUENCE_TRIGGERS = TRIGGERS.map(([name]) => name);

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "sync_sequences",
    {
      shop_id: { ...fk("shops", "CASCADE"), primaryKey: true },
      seq: { type: DataTypes.BIGINT.UNSIGNED, allowNull: false, defaultValue: 0 },
    },
    TABLE_OPTIONS,
  );
  await qi.addColumn("sync_changes", "seq", { type: DataTypes.BIGINT.UNSIGNED, allowNull: false, defaultValue: 0 });
  await qi.sequelize.query("UPDATE sync_changes SET seq = id");
  await qi.sequelize.query(
    "INSERT INTO sync_sequences (shop_id, seq) SELECT id, (SELECT COALESCE(MAX(id), 0) FROM sync_changes) FROM shops",
  );
  await qi.addIndex("sync_changes", ["job_id", "seq"], { name: "sync_changes_job_seq" });
  for (const [name, sql] of TRIGGERS) await qi.sequelize.query(`CREATE TRIGGER ${name} ${sql}`);
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  for (const [name] of TRIGGERS) await qi.sequelize.query(`DROP TRIGGER IF EXISTS ${name}`);
  await qi.removeIndex("sync_changes", "sync_changes_job_seq");
  // Plain SQL, as in 20261202000100 (QueryInterface.removeColumn trips over mariadb 3.x).
  await qi.sequelize.query("ALTER TABLE sync_changes DROP COLUMN seq");
  await qi.dropTable("sync_sequences");
}
