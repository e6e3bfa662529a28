import { JobList } from "@/components/job-list";
import { requirePageActor } from "@/lib/server/access";
import { listJobs } from "@/lib/server/jobs-repo";

export const metadata = { title: "Bench" };

export default async function BenchHome() {
  const actor = await requirePageActor(["machinist", "lead"], "/bench");
  const jobs = await listJobs(actor.shopId, ["intake", "measuring", "review"]);
  return (
    <main className="mx-auto flex max-w-5xl flex-col gap-6 px-4 py-6">
      <h1 className="text-3xl font-semibold">Jobs on the bench</h1>
      <JobList jobs={jobs} hrefFor={(j) => `/bench/${j.id}`} empty="No jobs are waiting for measurement." />
    </main>
  );
}
