import { requirePageActor } from "@/lib/server/core/access";
import { SpecTemplateForm } from "@/components/desk/spec-template-form";

export const metadata = { title: "New spec sheet" };

export default async function NewSpecPage() {
  await requirePageActor(["lead", "admin"]);
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6">
      <h1 className="text-3xl font-semibold">New spec sheet</h1>
      <SpecTemplateForm />
    </main>
  );
}
