import { AppHeader } from "@/components/app-header";
import { requirePageActor } from "@/lib/server/core/access";
import { SpecTemplateForm } from "../../_components/spec-template-form";

export const metadata = { title: "New spec sheet" };

export default async function NewSpecPage() {
  const actor = await requirePageActor(["lead", "admin"], "/desk/specs/new");
  return (
    <>
      <AppHeader actor={actor} current="/desk/specs" />
      <main className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6">
        <h1 className="text-3xl font-semibold">New spec sheet</h1>
        <SpecTemplateForm />
      </main>
    </>
  );
}
