// Jobs, and each job's own copy of its limits: a later template edit never changes a job.
import { DataTypes } from "sequelize";
import {
  TABLE_OPTIONS,
  UNIT_SYSTEMS,
  enumOf,
  fk,
  intId,
  limitColumns,
  timestamps,
  varchar,
  type MigrationParams,
} from "./column-helpers";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.createTable(
    "jobs",
    {
      id: intId(),
      shop_id: fk("shops", "RESTRICT"),
      customer_id: fk("customers", "RESTRICT"),
      engine_id: fk("engines", "RESTRICT"),
      // The template the limits were copied from; the copy (job_limits) outlives it.
      template_id: fk("spec_templates", "SET NULL"),
      code: varchar(24),
      title: varchar(160),
      unit_system: enumOf(UNIT_SYSTEMS),
      status: enumOf(["intake", "measuring", "review", "released", "closed"], "intake"),
      due_date: { type: DataTypes.DATEONLY, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      build_plan: { type: DataTypes.JSON, allowNull: true },
      // Bumped on every edit of the job's limits, so tablets know their snapshot is stale.
      spec_revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      locked_at: { type: DataTypes.DATE(3), allowNull: true },
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("jobs", ["shop_id", "code"], { name: "jobs_shop_code_unique", unique: true });
  await qi.addIndex("jobs", ["shop_id", "status"], { name: "jobs_shop_status" });

  await qi.createTable(
    "job_limits",
    {
      id: intId(),
      job_id: fk("jobs", "CASCADE"),
      ...limitColumns(),
      ...timestamps(),
    },
    TABLE_OPTIONS,
  );
  await qi.addIndex("job_limits", ["job_id", "sort_order"], { name: "job_limits_job_order" });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable("job_limits");
  await qi.dropTable("jobs");
}
