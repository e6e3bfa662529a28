import type { MailFile } from "@/lib/schemas/mail";

// The development mailbox: what the local fake SMTP server received, newest first.
const kb = (n: number) =>
  n >= 1024 * 1024 ? `${(n / 1048576).toFixed(1)} MB` : `${Math.max(1, Math.round(n / 1024))} KB`;

export function Mailbox({ files }: { files: MailFile[] }) {
  if (files.length === 0)
    return <p className="text-muted">No messages have arrived in the local mailbox for this shop yet.</p>;
  return (
    <ul className="flex flex-col gap-3">
      {files.map((f) => (
        <li key={f.file} className="rounded-tool border-2 border-rule bg-panel" data-testid="mailbox-message">
          <details>
            <summary className="flex cursor-pointer flex-wrap items-baseline gap-x-4 gap-y-1 p-3">
              <span className="font-semibold">{f.subject}</span>
              <span className="text-sm text-muted">to {f.to}</span>
              <span className="text-sm text-muted tabular">
                {f.date ? `${f.date.slice(0, 16).replace("T", " ")} UTC` : ""}
              </span>
              {f.attachments.length > 0 && (
                <span className="text-sm">
                  {f.attachments.length} attachment{f.attachments.length > 1 ? "s" : ""}
                </span>
              )}
            </summary>
            <div className="flex flex-col gap-3 border-t-2 border-rule p-3">
              {f.attachments.length > 0 && (
                <ul className="flex flex-wrap gap-2">
                  {f.attachments.map((a) => (
                    <li key={a.index}>
                      <a
                        className="inline-flex min-h-11 items-center rounded-tool border-2 border-steel px-3 font-semibold text-steel"
                        href={`/api/mail/files/${encodeURIComponent(f.file)}/attachments/${a.index}`}
                        target="_blank"
                        rel="noreferrer"
                      >
                        {a.filename} ({a.contentType}, {kb(a.size)})
                      </a>
                    </li>
                  ))}
                </ul>
              )}
              <pre className="whitespace-pre-wrap break-words font-sans text-sm">{f.text}</pre>
            </div>
          </details>
        </li>
      ))}
    </ul>
  );
}
