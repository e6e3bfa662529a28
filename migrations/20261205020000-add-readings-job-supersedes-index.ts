// A job's corrections: the feed and a job's current readings look for the readings that supersede
// others within a job. The single-column supersedes index cannot serve that at scale: nearly every
// reading has no correction, so its statistics put tens of thousands of rows behind each value
// (NULLs counted as one value) and a long IN list is planned as a scan of every reading. This index
// reaches a job's corrections directly (job_id, then the non-NULL supersedes).
import type { MigrationParams } from "./column-helpers";

const NAME = "readings_job_supersedes";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.addIndex("readings", ["job_id", "supersedes"], { name: NAME });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.removeIndex("readings", NAME);
}
