import "server-only";
import { Customer, Engine, Job } from "@/models";
import { getSequelize } from "@/lib/server/core/db";
import { notFound } from "@/lib/server/core/errors";
import type { JobStatus } from "@/lib/domain";
import type { UnitSystem } from "@/lib/schemas/enums";

export type JobSummary = {
  id: number;
  code: string;
  title: string;
  status: JobStatus;
  unitSystem: UnitSystem;
  dueDate: string | null;
  customer: string;
  engine: string;
};

function reshape(j: Job & { customer?: Customer; engine?: Engine }): JobSummary {
  return {
    id: j.id,
    code: j.code,
    title: j.title,
    status: j.status,
    unitSystem: j.unitSystem,
    dueDate: j.dueDate ?? null,
    customer: j.customer?.name ?? "",
    engine: j.engine?.description ?? "",
  };
}

export async function listJobs(shopId: number, statuses?: JobStatus[]): Promise<JobSummary[]> {
  getSequelize();
  const rows = await Job.findAll({
    where: { shopId, ...(statuses ? { status: statuses } : {}) },
    include: [
      { model: Customer, as: "customer" },
      { model: Engine, as: "engine" },
    ],
    order: [
      ["dueDate", "ASC"],
      ["id", "ASC"],
    ],
  });
  return rows.map((r) => reshape(r as Job & { customer?: Customer; engine?: Engine }));
}

/** A job of this shop, or a 404 that never reveals whether another shop has it. */
export async function getJobOrThrow(shopId: number, jobId: number) {
  getSequelize();
  const job = await Job.findOne({ where: { id: jobId, shopId } });
  if (!job) throw notFound("Job");
  return job;
}
