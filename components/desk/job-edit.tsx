"use client";

import { Loading, LoadFailed } from "./fields";
import { JobForm } from "./job-form";
import { useJob } from "./queries";
import { Notice } from "@/components/ui/notice";
import { lockedJobWords } from "@/lib/domain";

export function JobEdit({ jobId }: { jobId: number }) {
  const job = useJob(jobId);
  if (job.isPending) return <Loading what="the job" />;
  if (job.isError) return <LoadFailed what="the job" error={job.error} retry={() => job.refetch()} />;
  if (job.data.job.locked)
    return (
      <Notice tone="info" title="This job is locked">
        {lockedJobWords(job.data.job, "its details")}
      </Notice>
    );
  return <JobForm job={job.data} />;
}
