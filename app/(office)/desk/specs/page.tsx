import Link from "next/link";
import { requirePageActor } from "@/lib/server/core/access";
import { SpecList } from "@/components/desk/spec-list";

export const metadata = { title: "Spec sheets" };

// Lead and admin both edit templates: the admin manages the shop's templates and the lead
// owns the spec sheets the jobs run on.
export default async function SpecsPage() {
  await requirePageActor(["lead", "admin"]);
  const link = "inline-flex min-h-11 items-center rounded-tool px-4 font-semibold";
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div>
          <h1 className="text-3xl font-semibold">Spec sheets</h1>
          <p className="text-muted">
            Templates per engine type and build. A new job copies one; editing a sheet never changes a job already
            started.
          </p>
        </div>
        <div className="flex gap-2">
          <Link href="/desk/specs/import" className={`${link} border-2 border-rule bg-panel hover:border-muted`}>
            Import a file
          </Link>
          <Link href="/desk/specs/new" className={`${link} bg-steel text-steel-ink hover:brightness-110`}>
            New sheet
          </Link>
        </div>
      </div>
      <SpecList />
    </main>
  );
}
