import "server-only";
import { compactLimit, type LimitValues } from "@/lib/schemas/spec";
import { loadJobContext } from "./job-context";
import { isJobLocked } from "./jobs-admin-repo";

// A job's own limit snapshot: read it here, replace it and re-evaluate in reevaluate-write.ts.
export type JobLimitsView = {
  job: { id: number; code: string; title: string; unitSystem: "in" | "mm"; status: string; locked: boolean; specRevision: number };
  limits: LimitValues[];
};

export async function getJobLimits(shopId: number, jobId: number): Promise<JobLimitsView> {
  const { job, spec } = await loadJobContext(shopId, jobId);
  return {
    job: {
      id: job.id, code: job.code, title: job.title, unitSystem: job.unitSystem, status: job.status,
      locked: isJobLocked(job), specRevision: job.specRevision,
    },
    limits: spec.map((l) => compactLimit(l as LimitValues)),
  };
}
