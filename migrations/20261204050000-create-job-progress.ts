// job_progress: each job's required-station progress ("n of m required stations done"), counted by
// lib/domain/progress.ts and kept here, so the jobs board and the bench's job list can filter, sort
// and page in SQL without reading every reading of every job on each request.
//
// A kept count is used only while it is fresh: it was counted at the job's present
// `context_revision` (jobs.context_revision: the job, its engine and its limits) and at the job's
// present `readings_revision`, a token a trigger changes whenever a reading of the job is inserted
// or deleted (readings are otherwise never edited, except their verdict columns, which progress does
// not read). A trigger, not application code, so no writer (the sync ingest, a bulk load, a
// restore) can forget it. A stale count is counted again by the next request that shows it
// (lib/server/board/progress.ts), stored only if the token has not moved meanwhile.
import { DataTypes } from "sequelize";
import { TABLE_OPTIONS, type MigrationParams } from "./column-helpers";

const NEW_TOKEN = "UUID_SHORT()";
const bump = (row: "NEW" | "OLD") =>
  `INSERT INTO job_progress (job_id, readings_revision) VALUES (${row}.job_id, ${NEW_TOKEN})
    ON DUPLICATE KEY UPDATE readings_revision = ${NEW_TOKEN}`;
const TRIGGERS: [name: string, sql: string][] = [
  ["readings_progress_insert", `AFTER INSERT ON readings FOR EACH ROW ${bump("NEW")}`],
  ["readings_progress_delete", `AFTER DELETE ON readings FOR EACH ROW ${bump("OLD")}`],
];

export const PROGRESS_TRIGGERS = TRIGGERS.map(([name]) => name);

const token = (allowNull: boolean) => ({ type: DataTypes.BIGINT.UNSIGNED, allowNull });
const count = () => ({ type: DataTypes.INTEGER, allowNull: true });

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "job_progress",
    {
      job_id: {
        type: DataTypes.INTEGER,
        primaryKey: true,
        allowNull: false,
        references: { model: "jobs", key: "id" },
        onDelete: "CASCADE",
      },
      readings_revision: { ...token(false), defaultValue: 0 },
      // The two tokens the figures below were counted at (null: never counted).
      counted_readings_revision: token(true),
      counted_context_revision: token(true),
      // Null with a count taken: the job has no engine yet, so no route to count on.
      required_stations: count(),
      required_done: count(),
    },
    TABLE_OPTIONS,
  );
  for (const [name, sql] of TRIGGERS) await qi.sequelize.query(`CREATE TRIGGER ${name} ${sql}`);
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  for (const [name] of TRIGGERS) await qi.sequelize.query(`DROP TRIGGER IF EXISTS ${name}`);
  await qi.dropTable("job_progress");
}
