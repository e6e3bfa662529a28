import { requirePageActor } from "@/lib/server/core/access";
import { JobEdit } from "@/components/desk/job-edit";

export const metadata = { title: "Edit job" };

export default async function EditJobPage({ params }: { params: Promise<{ jobId: string }> }) {
  const { jobId } = await params;
  await requirePageActor(["lead"]);
  return (
    <main className="mx-auto flex max-w-5xl flex-col gap-6 px-4 py-6">
      <h1 className="text-3xl font-semibold">Edit job</h1>
      <JobEdit jobId={Number(jobId)} />
    </main>
  );
}
