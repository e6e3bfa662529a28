import { OfficeHeader } from "@/components/office-header";
import { requirePageActor } from "@/lib/server/core/access";

// Every desk, release, admin and audit page: signed in (else the sign-in page, which leads back
// here), under one header. Which roles may open a page is each page's own check, because they
// differ; it reuses the same lookup of who is signed in (one per request).
export default async function OfficeLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor();
  return (
    <>
      <OfficeHeader actor={{ name: actor.name, role: actor.role }} />
      {children}
    </>
  );
}
