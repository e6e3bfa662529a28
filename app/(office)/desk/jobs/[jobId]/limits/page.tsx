import Link from "next/link";
import { requirePageActor } from "@/lib/server/core/access";
import { JobLimitsEditor } from "@/components/desk/job-limits-form";

export const metadata = { title: "Job limits" };

export default async function JobLimitsPage({ params }: { params: Promise<{ jobId: string }> }) {
  const { jobId } = await params;
  await requirePageActor(["lead"]);
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-4 px-4 py-6">
      <Link
        href={`/desk/jobs/${jobId}`}
        className="inline-flex min-h-11 items-center self-start text-sm font-medium text-steel underline"
      >
        ← Back to the job
      </Link>
      <JobLimitsEditor jobId={Number(jobId)} />
    </main>
  );
}
