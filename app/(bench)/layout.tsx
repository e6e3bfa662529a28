import { AppHeader } from "@/components/app-header";
import { requirePageActor } from "@/lib/server/access";

export default async function BenchLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor(["machinist", "lead"], "/bench");
  return (
    <>
      <AppHeader actor={actor} current="/bench" />
      {children}
    </>
  );
}
