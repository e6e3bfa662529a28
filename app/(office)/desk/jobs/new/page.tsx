import { requirePageActor } from "@/lib/server/core/access";
import { JobForm } from "@/components/desk/job-form";

export const metadata = { title: "New job" };

export default async function NewJobPage() {
  await requirePageActor(["lead"]);
  return (
    <main className="mx-auto flex max-w-5xl flex-col gap-6 px-4 py-6">
      <h1 className="text-3xl font-semibold">New job</h1>
      <JobForm />
    </main>
  );
}
