import { requirePageActor } from "@/lib/server/core/access";
import { BearingGrades } from "@/components/desk/bearing-grades";

export const metadata = { title: "Bearing grade tables" };

export default async function BearingGradesPage() {
  const actor = await requirePageActor(["lead", "admin", "inspector"]);
  return (
    <main className="mx-auto flex max-w-5xl flex-col gap-4 px-4 py-6">
      <h1 className="text-2xl font-semibold">Bearing grade tables</h1>
      <p className="text-muted">
        Factory tables that give a shell grade for each housing code and journal code stamped on the parts. The
        maker&apos;s own table governs; check each import against it.
      </p>
      <BearingGrades canEdit={actor.role === "lead"} />
    </main>
  );
}
