// The shop archive reads a shop's readings a page at a time in (job, time taken, id) order; this
// index serves each page directly instead of sorting every reading of the shop again per page.
import type { MigrationParams } from "./column-helpers";

const NAME = "readings_shop_job_taken_id";

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.addIndex("readings", ["shop_id", "job_id", "taken_at", "id"], { name: NAME });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.removeIndex("readings", NAME);
}
