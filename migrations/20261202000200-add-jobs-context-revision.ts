// jobs.context_revision: a token that the database itself changes whenever anything the sync
// server caches about a job could have changed — the job row (status, lock, units, engine), its
// engine, or any of its limits (job_limits). POST /api/sync keeps each job's context (engine
// shape, limits, route) in memory and reuses it only while the token read under the job's row
// lock is unchanged (lib/server/sync/ingest-context.ts), so stale limits never judge a reading.
//
// Triggers, not application code, so no writer (limits edit, template apply, engine edit, release,
// reopen, a future one) can forget it. The token is UUID_SHORT(): unique for the server's life and
// across restarts, so even a job id reused after a rebuilt database never matches an old token.
// A row inserted with a token already set (a restore) keeps it.
import { DataTypes } from "sequelize";
import type { MigrationParams } from "./column-helpers";

const NEW_TOKEN = "UUID_SHORT()";
const TRIGGERS: [name: string, sql: string][] = [
  [
    "jobs_context_revision_insert",
    `BEFORE INSERT ON jobs FOR EACH ROW IF NEW.context_revision = 0 THEN SET NEW.context_revision = ${NEW_TOKEN}; END IF`,
  ],
  ["jobs_context_revision_update", `BEFORE UPDATE ON jobs FOR EACH ROW SET NEW.context_revision = ${NEW_TOKEN}`],
  [
    "engines_context_revision_update",
    `AFTER UPDATE ON engines FOR EACH ROW UPDATE jobs SET context_revision = ${NEW_TOKEN} WHERE engine_id IN (OLD.id, NEW.id)`,
  ],
  [
    "job_limits_context_revision_insert",
    `AFTER INSERT ON job_limits FOR EACH ROW UPDATE jobs SET context_revision = ${NEW_TOKEN} WHERE id = NEW.job_id`,
  ],
  [
    "job_limits_context_revision_update",
    `AFTER UPDATE ON job_limits FOR EACH ROW UPDATE jobs SET context_revision = ${NEW_TOKEN} WHERE id IN (OLD.job_id, NEW.job_id)`,
  ],
  [
    "job_limits_context_revision_delete",
    `AFTER DELETE ON job_limits FOR EACH ROW UPDATE jobs SET context_revision = ${NEW_TOKEN} WHERE id = OLD.job_id`,
  ],
];
export const CONTEXT_TRIGGERS = TRIGGERS.map(([name]) => name);

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.addColumn("jobs", "context_revision", {
    type: DataTypes.BIGINT.UNSIGNED,
    allowNull: false,
    defaultValue: 0,
  });
  await qi.sequelize.query(`UPDATE jobs SET context_revision = ${NEW_TOKEN}`);
  for (const [name, sql] of TRIGGERS) await qi.sequelize.query(`CREATE TRIGGER ${name} ${sql}`);
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  for (const [name] of TRIGGERS) await qi.sequelize.query(`DROP TRIGGER IF EXISTS ${name}`);
  // Plain SQL, as in 20261202000100 (QueryInterface.removeColumn trips over mariadb 3.x).
  await qi.sequelize.query("ALTER TABLE jobs DROP COLUMN context_revision");
}
