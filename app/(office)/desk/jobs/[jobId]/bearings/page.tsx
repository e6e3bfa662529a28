import Link from "next/link";
import { requirePageActor } from "@/lib/server/core/access";
import { BearingsPage } from "@/components/desk/bearings-page";

export const metadata = { title: "Bearing shells" };

export default async function BearingShellsPage({ params }: { params: Promise<{ jobId: string }> }) {
  const { jobId } = await params;
  await requirePageActor(["lead"]);
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-4 px-4 py-6 print:max-w-none print:px-0">
      <Link
        href={`/desk/jobs/${jobId}`}
        className="inline-flex min-h-11 items-center self-start text-sm font-medium text-steel underline print:hidden"
      >
        ← Back to the job
      </Link>
      <BearingsPage jobId={Number(jobId)} />
    </main>
  );
}
