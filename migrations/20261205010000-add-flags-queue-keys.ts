// The flag queue's sort keys and indexes (issue 15: a million readings behind the queue).
//
// Two keys the queue sorts by lived in other tables, so every page sorted the shop's whole queue:
// - `judged_at`: when the value was judged, the time its age counts from (the judged reading's
//   time, or the flag's own for a computed value, which has no one reading);
// - `job_code`: the job's code, for the "job" sort.
// Both are kept on the flag by triggers, so no writer (the ingest, a bulk load, a job's code edit)
// can forget them; a row inserted with them already set (a bulk copy) keeps them. A reading's time
// never changes and a flag never changes its reading, so `judged_at` is set once.
//
// One index per sort, each walked forwards or backwards for the two directions, its tie-breakers
// in the index so a page stops after its rows, and the filter columns at the end so a filter is
// checked inside the index. An enum sort is "worst first, oldest first" one way (hence DESC).
import { DataTypes } from "sequelize";
import type { MigrationParams } from "./column-helpers";

const TRIGGERS: [name: string, sql: string][] = [
  [
    "flags_judged_at_insert",
    `BEFORE INSERT ON flags FOR EACH ROW IF NEW.judged_at IS NULL THEN
      SET NEW.judged_at = COALESCE((SELECT r.taken_at FROM readings r WHERE r.id = NEW.reading_id), NEW.created_at);
    END IF`,
  ],
  [
    "flags_job_code_insert",
    `BEFORE INSERT ON flags FOR EACH ROW IF NEW.job_code IS NULL THEN
      SET NEW.job_code = (SELECT j.code FROM jobs j WHERE j.id = NEW.job_id);
    END IF`,
  ],
  [
    "jobs_code_to_flags",
    `AFTER UPDATE ON jobs FOR EACH ROW IF NOT (NEW.code <=> OLD.code) THEN
      UPDATE flags SET job_code = NEW.code WHERE job_id = NEW.id;
    END IF`,
  ],
];
export const FLAG_KEY_TRIGGERS = TRIGGERS.map(([name]) => name);

const INDEXES: [name: string, columns: string][] = [
  ["flags_queue_age", "shop_id, judged_at, id, state, verdict, reason"],
  ["flags_queue_job", "shop_id, job_code, station_id, id, state, verdict, reason"],
  ["flags_queue_station", "shop_id, station_id, id, state, verdict, reason"],
  ["flags_queue_value", "shop_id, value, id, state, verdict, reason"],
  ["flags_queue_deviation", "shop_id, deviation, id, state, verdict, reason"],
  ["flags_queue_verdict", "shop_id, verdict DESC, judged_at, id, state, reason"],
  ["flags_queue_reason", "shop_id, reason DESC, judged_at, id, state, verdict"],
  ["flags_queue_state", "shop_id, state DESC, judged_at, id, verdict, reason"],
];

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.addColumn("flags", "judged_at", { type: DataTypes.DATE(3), allowNull: true });
  await qi.addColumn("flags", "job_code", { type: DataTypes.STRING(24), allowNull: true });
  await qi.sequelize.query(
    `UPDATE flags f JOIN jobs j ON j.id = f.job_id LEFT JOIN readings r ON r.id = f.reading_id
        SET f.judged_at = COALESCE(r.taken_at, f.created_at), f.job_code = j.code`,
  );
  for (const [name, sql] of TRIGGERS) await qi.sequelize.query(`CREATE TRIGGER ${name} ${sql}`);
  for (const [name, columns] of INDEXES) await qi.sequelize.query(`CREATE INDEX ${name} ON flags (${columns})`);
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  for (const [name] of INDEXES) await qi.sequelize.query(`DROP INDEX IF EXISTS ${name} ON flags`);
  for (const [name] of TRIGGERS) await qi.sequelize.query(`DROP TRIGGER IF EXISTS ${name}`);
  // Plain SQL, as in 20261202000100 (QueryInterface.removeColumn trips over mariadb 3.x).
  await qi.sequelize.query("ALTER TABLE flags DROP COLUMN job_code, DROP COLUMN judged_at");
}
