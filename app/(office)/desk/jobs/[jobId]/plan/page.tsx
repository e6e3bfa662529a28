import Link from "next/link";
import { requirePageActor } from "@/lib/server/core/access";
import { PlanEditor } from "@/components/desk/plan-editor";

export const metadata = { title: "Build plan" };

export default async function PlanPage({ params }: { params: Promise<{ jobId: string }> }) {
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
      <PlanEditor jobId={Number(jobId)} />
    </main>
  );
}
