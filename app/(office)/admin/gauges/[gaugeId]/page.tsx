import { GaugeStudiesPage } from "@/components/admin/gauges/gauge-studies-page";
import { requirePageActor } from "@/lib/server/core/access";

export const metadata = { title: "Gauge and its studies" };

// One gauge: its calibration, its uncertainty budget, its setting master and its studies (admin, lead and
// inspector read; the admin edits the master).
export default async function GaugePage({ params }: { params: Promise<{ gaugeId: string }> }) {
  const actor = await requirePageActor(["admin", "lead", "inspector"]);
  const { gaugeId } = await params;
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6">
      <GaugeStudiesPage gaugeId={Number(gaugeId)} canEdit={actor.role === "admin"} />
    </main>
  );
}
