import { Suspense } from "react";
import { StudiesHome } from "@/components/bench/studies/studies-home";

export const metadata = { title: "Gauge studies" };

// One shell for every study step (?run=type1), so it can be precached and opens offline.
export default function GaugeStudiesPage() {
  return (
    <Suspense fallback={<main className="px-4 py-8 text-lg text-muted">Opening the studies…</main>}>
      <StudiesHome />
    </Suspense>
  );
}
