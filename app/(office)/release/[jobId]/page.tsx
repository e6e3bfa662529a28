import Link from "next/link";
import { ReleasePage } from "@/components/release/release-page";
import { requirePageActor } from "@/lib/server/core/access";

export const metadata = { title: "Release" };

// The inspector signs here; the lead sees the same page and may reopen a released job.
export default async function ReleaseJobPage({ params }: { params: Promise<{ jobId: string }> }) {
  const { jobId } = await params;
  const actor = await requirePageActor(["inspector", "lead"]);
  const role = actor.role === "lead" ? "lead" : "inspector";
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-4 px-4 py-6">
      <Link
        href={role === "inspector" ? "/release" : `/desk/jobs/${jobId}`}
        className="inline-flex min-h-11 items-center self-start text-sm font-medium text-steel underline"
      >
        {role === "inspector" ? "← All blocks for release" : "← Back to the job"}
      </Link>
      <ReleasePage jobId={Number(jobId)} role={role} accountName={actor.name} />
    </main>
  );
}
