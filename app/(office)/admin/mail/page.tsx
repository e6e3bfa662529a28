import { Notice } from "@/components/ui/notice";
import { requirePageActor } from "@/lib/server/core/access";
import { env } from "@/lib/server/core/env";
import { listMailFiles } from "@/lib/server/mail/files";
import { listOutbox } from "@/lib/server/mail/repo";
import { Mailbox } from "./_components/mailbox";
import { OutboxTable } from "./_components/outbox-table";

export const metadata = { title: "Mail" };
export const dynamic = "force-dynamic";

export default async function MailPage() {
  const actor = await requirePageActor(["admin"]);
  const [outbox, files] = await Promise.all([listOutbox(actor.shopId), listMailFiles(actor.shopId)]);
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6">
      <h1 className="text-3xl font-semibold">Mail</h1>
      <section className="rounded-tool border-2 border-rule bg-panel p-4">
        <h2 className="mb-1 text-xl font-semibold">Outgoing mail</h2>
        <p className="mb-3 text-sm text-muted">
          Build records go to customers on release, flag digests to leads, and ready-for-release notes to inspectors. A
          message that fails is tried again later, waiting longer each time; a release never waits for mail.
        </p>
        <OutboxTable rows={outbox} maxAttempts={env().MAIL_MAX_ATTEMPTS} />
      </section>
      <section className="rounded-tool border-2 border-rule bg-panel p-4">
        <h2 className="mb-1 text-xl font-semibold">Local mailbox (development)</h2>
        {files === null ? (
          <Notice>
            The local mailbox shows here only when MAIL_DIR is set (npm start sets it to .data/mail). With a real mail
            server, check the recipients&apos; inboxes.
          </Notice>
        ) : (
          <>
            <p className="mb-3 text-sm text-muted">
              What the local fake mail server received for this shop, newest first. Open a message to read it and its
              attachments.
            </p>
            <Mailbox files={files} />
          </>
        )}
      </section>
    </main>
  );
}
