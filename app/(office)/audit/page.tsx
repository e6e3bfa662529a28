import { Suspense } from "react";
import { AuditBrowser } from "@/components/audit/audit-browser";
import { Loading } from "@/components/release/query-states";
import { requirePageActor } from "@/lib/server/core/access";
import { AUDIT_ROLES } from "@/lib/schemas/enums";

export const metadata = { title: "Audit trail" };

export default async function AuditPage() {
  await requirePageActor(AUDIT_ROLES);
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-4 px-4 py-6">
      <div>
        <h1 className="text-3xl font-semibold">Audit trail</h1>
        <p className="text-muted">
          Every change in the shop, who made it and when, with the values before and after. Entries are never edited or
          deleted.
        </p>
      </div>
      <Suspense fallback={<Loading what="the audit trail" />}>
        <AuditBrowser />
      </Suspense>
    </main>
  );
}
