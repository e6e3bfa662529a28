import type { MailKind, OutboxMessage } from "@/lib/schemas/mail";
import { RetryButton } from "./retry-button";

// The shop's outgoing mail with what happened to each message, failures in words.
const KIND_WORDS: Record<MailKind, string> = {
  build_record: "Build record to customer",
  record_voided: "Record voided, to customer",
  flag_digest: "New flags, to a lead",
  ready_for_release: "Ready for release, to an inspector",
  shop_verification: "E-mail confirmation for a new shop",
  shop_address_taken: "New shop refused: address already has an account",
  invitation: "Invitation to set a password",
  password_reset: "Password reset link",
};

const at = (d: Date) => `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;

function Status({ m, maxAttempts }: { m: OutboxMessage; maxAttempts: number }) {
  if (m.sentAt) return <p className="font-semibold text-pass">Sent {at(m.sentAt)}</p>;
  const gaveUp = m.attempts >= maxAttempts;
  return (
    <div className="flex flex-col gap-1">
      <p className={`font-semibold ${m.attempts ? "text-fail" : "text-muted"}`}>
        {gaveUp
          ? `Not sent: stopped after ${m.attempts} failed attempts`
          : m.attempts
            ? `Not sent yet: ${m.attempts} failed attempt${m.attempts > 1 ? "s" : ""}; next try ${at(m.nextAttemptAt)}`
            : `Waiting to send (due ${at(m.nextAttemptAt)})`}
      </p>
      {m.lastError && (
        <p className="break-words text-sm" data-testid="mail-error">
          {m.lastError}
        </p>
      )}
      <RetryButton id={m.id} />
    </div>
  );
}

export function OutboxTable({ rows, maxAttempts }: { rows: OutboxMessage[]; maxAttempts: number }) {
  if (rows.length === 0)
    return (
      <p className="text-muted">
        Nothing has been queued yet. Releases, new flags and jobs ready for release each queue a message here.
      </p>
    );
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm">
        <thead className="border-b-2 border-rule text-muted">
          <tr>
            <th className="py-2 pr-3">Queued</th>
            <th className="pr-3">What</th>
            <th className="pr-3">To</th>
            <th className="pr-3">Subject</th>
            <th>Status</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-rule">
          {rows.map((m) => (
            <tr key={m.id} className="align-top" data-testid="outbox-row">
              <td className="py-2 pr-3 whitespace-nowrap tabular">{at(m.createdAt)}</td>
              <td className="py-2 pr-3">{KIND_WORDS[m.kind] ?? m.kind}</td>
              <td className="py-2 pr-3 break-all">{m.toAddress}</td>
              <td className="py-2 pr-3">{m.subject}</td>
              <td className="py-2">
                <Status m={m} maxAttempts={maxAttempts} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
