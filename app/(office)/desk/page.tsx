import { AppHeader } from "@/components/app-header";
import { JobList } from "@/components/job-list";
import { requirePageActor } from "@/lib/server/access";
import { listJobs } from "@/lib/server/jobs-repo";

export const metadata = { title: "Jobs" };

export default async function DeskHome() {
  const actor = await requirePageActor(["lead"], "/desk");
  const jobs = await listJobs(actor.shopId);
  return (
    <>
      <AppHeader actor={actor} current="/desk" />
      <main className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6">
        <h1 className="text-3xl font-semibold">Jobs</h1>
        <JobList jobs={jobs} hrefFor={(j) => `/desk/jobs/${j.id}`} empty="No jobs yet." />
      </main>
    </>
  );
}
