import Link from "next/link";
import { requirePageActor } from "@/lib/server/core/access";
import { JobPage } from "@/components/desk/job-page";

export const metadata = { title: "Job" };

// The lead works the job here; the admin may read it.
export default async function JobDeskPage({ params }: { params: Promise<{ jobId: string }> }) {
  const { jobId } = await params;
  const actor = await requirePageActor(["lead", "admin"]);
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-4 px-4 py-6">
      <Link
        href="/desk"
        className="inline-flex min-h-11 items-center self-start text-sm font-medium text-steel underline"
      >
        ← All jobs
      </Link>
      <JobPage jobId={Number(jobId)} role={actor.role} />
    </main>
  );
}
