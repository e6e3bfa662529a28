import Link from "next/link";
import { StatusTag, type StatusTone } from "@/components/admin/status-tag";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import { REASON_TAG_WORDS } from "@/lib/schemas/flag";
import type { FlagSummary } from "@/lib/schemas/release";

// The job's flags with the lead's decisions: what was out, what was decided, by whom and why.
const when = (iso: string | null) => (iso ? new Date(iso).toISOString().slice(0, 10) : "");

function decision(f: FlagSummary): { tone: StatusTone; words: string; detail: string | null } {
  const by = f.disposedByName ? `${f.disposedByName}, ${when(f.disposedAt)}` : null;
  if (f.state === "closed")
    return { tone: "good", words: "Closed", detail: `A new in-spec reading closed it ${when(f.closedAt)}` };
  if (f.state === "open" || !f.disposition)
    return { tone: "bad", words: "Open", detail: "Waiting for the lead's decision" };
  if (f.disposition === "accept")
    return { tone: "soon", words: "Accepted as is", detail: [f.dispositionReason, by].filter(Boolean).join(" — ") };
  const what =
    f.disposition === "machine_again" ? `Machine again${f.operation ? ` (${f.operation})` : ""}` : "Measure again";
  return { tone: "bad", words: what, detail: `Waiting for a new reading${by ? ` — ${by}` : ""}` };
}

export function FlagsList({ flags }: { flags: FlagSummary[] }) {
  return (
    <section aria-labelledby="flags-h" className="rounded-tool border-2 border-rule bg-panel p-4">
      <h2 id="flags-h" className="text-xl font-semibold">
        Flags and decisions
      </h2>
      {flags.length === 0 ? (
        <p className="mt-2 text-muted">No reading or computed value of this job was flagged.</p>
      ) : (
        <div className="mt-2 overflow-x-auto">
          <table className="w-full text-left text-sm">
            <thead className="border-b-2 border-rule text-muted">
              <tr>
                <th className="py-2 pr-3">Flag</th>
                <th className="pr-3">Where</th>
                <th className="pr-3">Value</th>
                <th className="pr-3">Verdict</th>
                <th>Decision</th>
              </tr>
            </thead>
            <tbody>
              {flags.map((f) => {
                const d = decision(f);
                return (
                  <tr key={f.id} className="border-b border-rule align-top" data-flag={f.id}>
                    <td className="py-2 pr-3">
                      <Link
                        className="inline-flex min-h-11 min-w-11 items-center font-mono font-medium text-steel underline"
                        href={`/desk/flags/${f.id}`}
                      >
                        #{f.id}
                      </Link>
                    </td>
                    <td className="py-2 pr-3">
                      <span className="font-medium">{f.what}</span>
                      <span className="block text-muted">{f.station}</span>
                    </td>
                    <td className="tabular py-2 pr-3 font-mono">{f.value}</td>
                    <td className="whitespace-nowrap py-2 pr-3">
                      <VerdictBadge verdict={f.verdict} size="sm" />
                      {f.reason !== f.verdict && (
                        <span className="block text-xs text-muted">{REASON_TAG_WORDS[f.reason]}</span>
                      )}
                    </td>
                    <td className="py-2">
                      <StatusTag tone={d.tone}>{d.words}</StatusTag>
                      {d.detail && <span className="mt-1 block text-muted">{d.detail}</span>}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
