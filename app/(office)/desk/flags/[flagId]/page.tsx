import { notFound } from "next/navigation";
import { FlagDetailView } from "@/components/flags/flag-detail";
import { requirePageActor } from "@/lib/server/core/access";

export const metadata = { title: "Flag" };

export default async function FlagPage({ params }: { params: Promise<{ flagId: string }> }) {
  const { flagId } = await params;
  const actor = await requirePageActor(["lead", "inspector"]);
  const id = Number(flagId);
  if (!Number.isInteger(id) || id <= 0) notFound();
  return (
    <main className="mx-auto flex max-w-6xl flex-col gap-6 px-4 py-6">
      <FlagDetailView flagId={id} canDecide={actor.role === "lead"} />
    </main>
  );
}
