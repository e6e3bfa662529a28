import type { Metadata } from "next";
import { LinkProblem } from "@/components/record/link-problem";
import { RecordSummary } from "@/components/record/record-summary";
import { Wordmark } from "@/components/ui/logo";
import { customerView } from "@/lib/server/release/customer-view";
import { asPageError } from "@/lib/server/core/access";

// The customer's view of their build record, opened from the e-mailed link: no account, no
// navigation into the app, nothing but this one record and its PDF.
export const dynamic = "force-dynamic";
export const metadata: Metadata = {
  title: "Your build record",
  robots: { index: false, follow: false },
  referrer: "no-referrer",
};

const day = (d: Date) => d.toISOString().slice(0, 10);

export default async function CustomerRecordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  // An outage reads as the calm "cannot reach its database" screen (app/error.tsx), not a crash.
  const view = await customerView(token).catch((err: unknown) => {
    throw asPageError(err);
  });
  if (view.status === "invalid") return <LinkProblem kind="invalid" />;
  if (view.status === "expired") return <LinkProblem kind="expired" expiredOn={day(view.expiredAt)} shop={view.shop} />;
  const { record } = view;
  return (
    <main className="mx-auto flex max-w-4xl flex-col gap-6 px-4 py-8">
      <header className="flex flex-wrap items-center justify-between gap-4">
        <Wordmark />
        <p className="text-sm text-muted">
          For {record.customer.name} from {record.shop.name}
        </p>
      </header>
      <div>
        <h1 className="text-3xl font-semibold">Build record {record.job.code}</h1>
        <p className="text-lg">{record.job.title}</p>
      </div>
      <div className="flex flex-wrap items-center gap-4">
        <a
          href={`/api/r/${encodeURIComponent(token)}/pdf`}
          download
          className={
            "inline-flex min-h-16 items-center justify-center rounded-tool bg-steel px-6 text-lg font-semibold " +
            "text-steel-ink hover:brightness-110"
          }
        >
          Download the full record (PDF)
        </a>
        <p className="text-sm text-muted">This link works until {day(view.expiresAt)}.</p>
      </div>
      <RecordSummary record={record} />
    </main>
  );
}
