import { requirePageActor } from "@/lib/server/core/access";
import { SpecImport } from "@/components/desk/spec-import";

export const metadata = { title: "Import a spec sheet" };

export default async function ImportSpecPage() {
  await requirePageActor(["lead", "admin"]);
  return (
    <main className="mx-auto flex max-w-5xl flex-col gap-6 px-4 py-6">
      <h1 className="text-3xl font-semibold">Import a spec sheet</h1>
      <SpecImport />
    </main>
  );
}
