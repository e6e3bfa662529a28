import { Suspense } from "react";
import { BenchJob } from "@/components/bench/bench-job";

export const metadata = { title: "Bench job" };

// One shell for every job (/bench/job?id=12): a per-job server page could not be precached.
export default function BenchJobPage() {
  return (
    <Suspense fallback={<main className="px-4 py-8 text-lg text-muted">Opening the job…</main>}>
      <BenchJob />
    </Suspense>
  );
}
