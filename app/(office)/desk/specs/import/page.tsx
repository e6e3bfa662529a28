import { AppHeader } from "@/components/app-header";
import { requirePageActor } from "@/lib/server/core/access";
import { SpecImport } from "../../_components/spec-import";

export const metadata = { title: "Import a spec sheet" };

export default async function ImportSpecPage() {
  const actor = await requirePageActor(["lead", "admin"], "/desk/specs/import");
  return (
    <>
      <AppHeader actor={actor} current="/desk/specs" />
      <main className="mx-auto flex max-w-5xl flex-col gap-6 px-4 py-6">
        <h1 className="text-3xl font-semibold">Import a spec sheet</h1>
        <SpecImport />
      </main>
    </>
  );
}
