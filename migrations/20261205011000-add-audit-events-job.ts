// audit_events.job_id: the job an event is about, kept on the event (issue 15: the audit trail of a
// million readings). An event names an entity, not a job, so the trail worked out every event's job
// as it read, for the whole shop, on every page. Now a trigger works it out once, as the event is
// written: the job itself, the job of a reading / flag / release / attachment, else a jobId written
// in the event's after or before. Every such row exists when its event is written (the event is
// written in the change's own transaction, after the change). A row inserted with a job already
// set (a bulk copy) keeps it. Null: the event is about no job (a user, a gauge, a spec sheet).
//
// Events are append-only (20261201001000): the fill of the events already written runs with the
// refusal of UPDATE lifted for this migration alone, and touches no other column.
import { APPEND_ONLY_MESSAGE } from "./20261201001000-create-audit-events";
import type { MigrationParams } from "./column-helpers";

// A whole number that fits INT, else null: a word never becomes job 0 nor fails the insert.
const whole = (v: string) => `IF(${v} REGEXP '^[0-9]{1,9}$', CAST(${v} AS UNSIGNED), NULL)`;

/** The job of the event in row `e` (NEW in the trigger, the table's alias in the fill). */
export function jobOfEvent(e: string): string {
  const after = (key: string) => `JSON_VALUE(${e}.after, '$.${key}')`;
  return `CASE ${e}.entity_type
    WHEN 'job' THEN ${whole(`${e}.entity_id`)}
    WHEN 'job_limits' THEN ${whole(`${e}.entity_id`)}
    WHEN 'reading' THEN (SELECT r.job_id FROM readings r WHERE r.id = ${e}.entity_id AND r.shop_id = ${e}.shop_id)
    WHEN 'flag' THEN (SELECT f.job_id FROM flags f
      WHERE f.id = ${whole(`${e}.entity_id`)} AND f.shop_id = ${e}.shop_id)
    WHEN 'release' THEN (SELECT rl.job_id FROM releases rl
      WHERE rl.id = ${whole(`${e}.entity_id`)} AND rl.shop_id = ${e}.shop_id)
    WHEN 'attachment' THEN CASE ${after("ownerType")}
      WHEN 'job' THEN ${whole(after("ownerId"))}
      WHEN 'reading' THEN (SELECT r2.job_id FROM readings r2 WHERE r2.id = ${after("ownerId")} AND r2.shop_id = ${e}.shop_id)
      END
    ELSE ${whole(`COALESCE(${after("jobId")}, JSON_VALUE(${e}.before, '$.jobId'))`)}
  END`;
}

const TRIGGER = "audit_events_job";
const NO_UPDATE =
  "CREATE TRIGGER audit_events_no_update BEFORE UPDATE ON audit_events FOR EACH ROW " +
  `SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = '${APPEND_ONLY_MESSAGE}'`;

const INDEXES: [name: string, columns: string][] = [
  ["audit_events_shop_order", "shop_id, id"],
  ["audit_events_shop_job", "shop_id, job_id, id"],
  ["audit_events_shop_action", "shop_id, action, id"],
  ["audit_events_shop_entity", "shop_id, entity_type, entity_id, id"],
  ["audit_events_shop_user", "shop_id, user_id, id"],
];

export async function up({ context: qi }: MigrationParams): Promise<void> {
  const q = (sql: string) => qi.sequelize.query(sql);
  await q("ALTER TABLE audit_events ADD COLUMN job_id INT NULL");
  await q("DROP TRIGGER audit_events_no_update");
  try {
    await q(`UPDATE audit_events e SET e.job_id = ${jobOfEvent("e")}`);
  } finally {
    await q(NO_UPDATE);
  }
  await q(`CREATE TRIGGER ${TRIGGER} BEFORE INSERT ON audit_events FOR EACH ROW
    IF NEW.job_id IS NULL THEN SET NEW.job_id = ${jobOfEvent("NEW")}; END IF`);
  for (const [name, columns] of INDEXES) await q(`CREATE INDEX ${name} ON audit_events (${columns})`);
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  for (const [name] of INDEXES) await qi.sequelize.query(`DROP INDEX IF EXISTS ${name} ON audit_events`);
  await qi.sequelize.query(`DROP TRIGGER IF EXISTS ${TRIGGER}`);
  await qi.sequelize.query("ALTER TABLE audit_events DROP COLUMN job_id");
}
