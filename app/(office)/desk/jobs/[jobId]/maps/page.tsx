import { notFound } from "next/navigation";
import { MapsView } from "@/components/maps/maps-view";
import { requirePageActor } from "@/lib/server/core/access";

export const metadata = { title: "Maps" };

export default async function MapsPage({ params }: { params: Promise<{ jobId: string }> }) {
  const { jobId } = await params;
  await requirePageActor(["lead", "inspector"]);
  const id = Number(jobId);
  if (!Number.isInteger(id) || id <= 0) notFound();
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6 print:max-w-none print:px-0">
      <MapsView jobId={id} />
    </main>
  );
}
