import "server-only";
import type { Transaction } from "sequelize";
import { currentReadings } from "@/lib/domain";
import type { ReleaseChecklist } from "@/lib/schemas/release";
import { readingsCheck, torqueCheck } from "@/lib/server/release/checklist-rules";
import { flagsCheck, planCheck } from "@/lib/server/release/checklist-review";
import { gaugesCheck } from "@/lib/server/release/checklist-gauges";
import { loadJobRecord, type JobRecord } from "@/lib/server/release/repo";

// What still stands between a job and its release, in words, each with a link to fix it, and
// what is already complete. Computed on the server from the job's record alone (read in a few
// queries, no writes), so the notifier can call it on a timer and the inspector's page on every view.

/** The checklist from an already loaded record (pure). */
export function checklistOf(record: JobRecord): ReleaseChecklist {
  const current = currentReadings(record.readings);
  const checks = [
    readingsCheck(record, current),
    flagsCheck(record),
    gaugesCheck(record, current),
    torqueCheck(record, current),
    planCheck(record),
  ];
  const unmet = checks.flatMap((c) => c.items);
  return { jobId: record.job.id, complete: unmet.length === 0, checks, unmet };
}

/** The release checklist of a job of this shop (404 for another shop's job). */
export async function releaseChecklist(shopId: number, jobId: number, t?: Transaction): Promise<ReleaseChecklist> {
  return checklistOf(await loadJobRecord(shopId, jobId, t));
}
