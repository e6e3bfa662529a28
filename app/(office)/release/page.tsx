import { ReleaseBoard } from "@/components/release/release-board";
import { requirePageActor } from "@/lib/server/core/access";

export const metadata = { title: "Release" };

export default async function ReleaseHome() {
  await requirePageActor(["inspector", "lead"]);
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6">
      <h1 className="text-3xl font-semibold">Blocks for release</h1>
      <ReleaseBoard />
    </main>
  );
}
