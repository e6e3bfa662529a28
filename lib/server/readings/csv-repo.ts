import "server-only";
import { readRows } from "@/lib/server/core/sql-read";

// The readings CSV's own read (csv-export-stream.ts) besides the readings themselves (repo.ts):
// plain rows through the driver (sql-read.ts). The flags it prints come from the flags feature.

/** The stations of a job that have any reading. */
export async function stationsWithReadings(jobId: number): Promise<string[]> {
  const rows = await readRows<{ stationId: string }>(
    "SELECT DISTINCT station_id AS stationId FROM readings WHERE job_id = ?",
    [jobId],
  );
  return rows.map((r) => r.stationId);
}
