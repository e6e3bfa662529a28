import { GaugeAdmin } from "@/components/admin/gauges/gauge-admin";
import { requirePageActor } from "@/lib/server/core/access";

export const metadata = { title: "Gauges" };

// The admin manages gauges; the lead and the inspector see them (read only).
export default async function GaugesPage() {
  const actor = await requirePageActor(["admin", "lead", "inspector"]);
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6">
      <h1 className="text-3xl font-semibold">Gauges and calibration</h1>
      <GaugeAdmin canEdit={actor.role === "admin"} />
    </main>
  );
}
