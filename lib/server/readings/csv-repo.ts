import "server-only";
import { readRows } from "@/lib/server/core/sql-read";

// The readings CSV's own reads (csv-export-stream.ts) besides the readings themselves (repo.ts):
// plain rows through the driver (sql-read.ts).

/** The stations of a job that have any reading. */
export async function stationsWithReadings(jobId: number): Promise<string[]> {
  const rows = await readRows<{ stationId: string }>(
    "SELECT DISTINCT station_id AS stationId FROM readings WHERE job_id = ?",
    [jobId],
  );
  return rows.map((r) => r.stationId);
}

/** A flag of a job with its latest decision (the readings CSV's decision column). */
export type FlagDecisionRow = {
  id: number;
  readingId: string | null;
  derivedKey: string | null;
  state: string;
  disposition: string | null;
  operation: string | null;
};

/**
 * The job's flags, oldest first, of these readings, and with `derived`, of its computed values too:
 * one statement (the CSV reads them with each page of readings).
 */
export async function flagDecisions(
  shopId: number,
  jobId: number,
  readingIds: string[],
  derived = false,
): Promise<FlagDecisionRow[]> {
  const of = [...(readingIds.length ? ["reading_id IN (?)"] : []), ...(derived ? ["derived_key IS NOT NULL"] : [])];
  if (!of.length) return [];
  return readRows<FlagDecisionRow>(
    `SELECT id, reading_id AS readingId, derived_key AS derivedKey, state, disposition, operation FROM flags
      WHERE shop_id = ? AND job_id = ? AND (${of.join(" OR ")}) ORDER BY id`,
    [shopId, jobId, ...(readingIds.length ? [readingIds] : [])],
  );
}
