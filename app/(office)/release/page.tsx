import { AppHeader } from "@/components/app-header";
import { JobList } from "@/components/job-list";
import { requirePageActor } from "@/lib/server/access";
import { listJobs } from "@/lib/server/jobs-repo";

export const metadata = { title: "Release" };

export default async function ReleaseHome() {
  const actor = await requirePageActor(["inspector"], "/release");
  const jobs = await listJobs(actor.shopId, ["measuring", "review", "released"]);
  return (
    <>
      <AppHeader actor={actor} current="/release" />
      <main className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6">
        <h1 className="text-3xl font-semibold">Blocks for release</h1>
        <JobList jobs={jobs} hrefFor={(j) => `/release/${j.id}`} empty="No blocks are waiting for release." />
      </main>
    </>
  );
}
