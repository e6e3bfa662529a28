// Limits that follow the job: each job states the sizes it machines to (finished bore, main and
// rod journal, after any oversize or undersize), the engine may state its standard journal sizes,
// and a limit may be a tolerance around the job's own size (limit type job_size_tol).
// Sizes are in the unit system of their row (the job's, the engine's); empty when not stated.
// jobs and engines already renew jobs.context_revision on any update (20261202000200), so a
// changed size is never judged with a cached context.
import { decimal, type MigrationParams } from "./column-helpers";

const OLD_TYPES = ["min_max", "nominal_tol", "max_only", "min_only", "per_inch", "iso286"];
const NEW_TYPES = [...OLD_TYPES, "job_size_tol"];
const LIMIT_TABLES = ["spec_limits", "job_limits"] as const;
const JOB_COLUMNS = ["finished_bore", "finished_main_journal", "finished_rod_journal"] as const;
const ENGINE_COLUMNS = ["nominal_main_journal", "nominal_rod_journal"] as const;

const enumSql = (values: string[]) => `ENUM(${values.map((v) => `'${v}'`).join(", ")}) NOT NULL`;

export async function up({ context: qi }: MigrationParams): Promise<void> {
  for (const table of LIMIT_TABLES) {
    await qi.sequelize.query(`ALTER TABLE ${table} MODIFY limit_type ${enumSql(NEW_TYPES)}`);
  }
  for (const column of JOB_COLUMNS) await qi.addColumn("jobs", column, decimal(10, 5));
  for (const column of ENGINE_COLUMNS) await qi.addColumn("engines", column, decimal(10, 4));
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  // A job-size limit becomes a plain tolerance around the size its job stated (a template's has
  // no job, so its nominal stays empty and the spec editor asks for it): nothing typed is lost.
  await qi.sequelize.query(
    `UPDATE job_limits jl JOIN jobs j ON j.id = jl.job_id SET jl.nominal = CASE jl.characteristic
       WHEN 'bore_diameter' THEN j.finished_bore
       WHEN 'main_journal_diameter' THEN j.finished_main_journal
       WHEN 'rod_journal_diameter' THEN j.finished_rod_journal END
     WHERE jl.limit_type = 'job_size_tol'`,
  );
  for (const table of LIMIT_TABLES) {
    await qi.sequelize.query(`UPDATE ${table} SET limit_type = 'nominal_tol' WHERE limit_type = 'job_size_tol'`);
    await qi.sequelize.query(`ALTER TABLE ${table} MODIFY limit_type ${enumSql(OLD_TYPES)}`);
  }
  // Plain SQL, as in 20261202000100 (QueryInterface.removeColumn trips over mariadb 3.x).
  await qi.sequelize.query(`ALTER TABLE jobs ${JOB_COLUMNS.map((c) => `DROP COLUMN ${c}`).join(", ")}`);
  await qi.sequelize.query(`ALTER TABLE engines ${ENGINE_COLUMNS.map((c) => `DROP COLUMN ${c}`).join(", ")}`);
}
