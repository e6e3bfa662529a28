import Link from "next/link";
import { requirePageActor } from "@/lib/server/core/access";
import { SpecEdit } from "@/components/desk/spec-edit";

export const metadata = { title: "Spec sheet" };

export default async function SpecPage({ params }: { params: Promise<{ templateId: string }> }) {
  const { templateId } = await params;
  await requirePageActor(["lead", "admin"]);
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6">
      <Link
        href="/desk/specs"
        className="inline-flex min-h-11 items-center self-start text-sm font-medium text-steel underline"
      >
        ← All spec sheets
      </Link>
      <SpecEdit templateId={Number(templateId)} />
    </main>
  );
}
