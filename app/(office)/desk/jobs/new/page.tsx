import { AppHeader } from "@/components/app-header";
import { requirePageActor } from "@/lib/server/core/access";
import { JobForm } from "../../_components/job-form";

export const metadata = { title: "New job" };

export default async function NewJobPage() {
  const actor = await requirePageActor(["lead"], "/desk/jobs/new");
  return (
    <>
      <AppHeader actor={actor} current="/desk" />
      <main className="mx-auto flex max-w-5xl flex-col gap-6 px-4 py-6">
        <h1 className="text-3xl font-semibold">New job</h1>
        <JobForm />
      </main>
    </>
  );
}
