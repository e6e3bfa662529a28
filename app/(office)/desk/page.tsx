import Link from "next/link";
import { requirePageActor } from "@/lib/server/core/access";
import { JobsBoard } from "@/components/desk/jobs-board";
import { FirstJobGuide } from "@/components/desk/first-job-guide";

export const metadata = { title: "Jobs" };

// The lead's home; the admin may read it.
export default async function DeskHome() {
  const actor = await requirePageActor(["lead", "admin"]);
  const lead = actor.role === "lead";
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-3xl font-semibold">Jobs</h1>
        {lead && (
          <Link
            href="/desk/jobs/new"
            className="inline-flex min-h-11 items-center rounded-tool bg-steel px-4 font-semibold text-steel-ink hover:brightness-110"
          >
            New job
          </Link>
        )}
      </div>
      <FirstJobGuide role={actor.role} />
      <JobsBoard canCreate={lead} />
    </main>
  );
}
