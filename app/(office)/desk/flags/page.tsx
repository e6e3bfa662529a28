import { Suspense } from "react";
import { FlagQueue } from "@/components/flags/flag-queue";
import { requirePageActor } from "@/lib/server/core/access";
import { listJobs } from "@/lib/server/jobs/repo";

export const metadata = { title: "Flags" };

export default async function FlagsPage() {
  const actor = await requirePageActor(["lead", "inspector"]);
  const jobs = (await listJobs(actor.shopId)).map((j) => ({ id: j.id, code: j.code, title: j.title }));
  return (
    <main className="mx-auto flex max-w-[96rem] flex-col gap-5 px-4 py-6">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h1 className="text-3xl font-semibold">Flags</h1>
        <p className="text-sm text-muted">
          Values out of spec, marginal (within the gauge&apos;s uncertainty of a limit), or read with a gauge past its
          calibration due date.
          {actor.role === "lead" ? " Open one to decide." : " Read only for inspectors."}
        </p>
      </div>
      <Suspense fallback={<p className="text-muted">Loading flags…</p>}>
        <FlagQueue jobs={jobs} />
      </Suspense>
    </main>
  );
}
