import { VerdictBadge } from "@/components/ui/verdict-badge";
import type { FlagDetail, HistoryReading } from "@/lib/schemas/flag";
import { when, withUnit } from "./format";

// Every reading of the flag's station(s), oldest first, with the correction chain spelled out.
function chain(r: HistoryReading, all: HistoryReading[]): string[] {
  const at = (id: string | null) => all.find((x) => x.id === id);
  const out: string[] = [];
  if (r.supersedes) out.push(`corrects the reading of ${when(at(r.supersedes)?.takenAt ?? null)}`);
  if (r.supersededBy) out.push(`corrected by the reading of ${when(at(r.supersededBy)?.takenAt ?? null)}`);
  return out;
}

function Photos({ r }: { r: HistoryReading }) {
  if (!r.photos.length) return null;
  return (
    <ul className="mt-2 flex flex-wrap gap-2" aria-label="Photos">
      {r.photos.map((p) => (
        <li key={p.id}>
          <a
            href={p.url}
            target="_blank"
            rel="noreferrer"
            className="flex flex-col items-start gap-1 text-xs text-steel underline"
          >
            {p.thumbUrl ? (
              <img src={p.thumbUrl} alt={p.name} className="h-20 w-28 rounded-tool border-2 border-rule object-cover" />
            ) : null}
            {p.name}
          </a>
        </li>
      ))}
    </ul>
  );
}

function Row({ r, all }: { r: HistoryReading; all: HistoryReading[] }) {
  const marks = [r.flagged ? "this flag" : null, r.current ? "current figure" : null].filter(Boolean).join(" · ");
  return (
    <tr className={`border-t-2 border-rule align-top ${r.current ? "" : "text-muted"}`} data-reading-id={r.id}>
      <td className="p-2 text-sm">
        <div className="text-ink">{when(r.takenAt)}</div>
        <div className="text-xs">{r.takenBy ?? "unknown"}</div>
      </td>
      <td className="p-2 tabular">{r.skipped ? `skipped: ${r.skipReason ?? ""}` : withUnit(r.value, r.unit)}</td>
      <td className="p-2">
        {r.verdict ? <VerdictBadge verdict={r.verdict} size="sm" /> : <span className="text-sm">no verdict</span>}
        {r.verdictNote === "gauge_past_due" && <div className="mt-1 text-xs font-medium">gauge past due</div>}
      </td>
      <td className="p-2 text-sm">{r.gauge ? `${r.gauge.label} (${r.gauge.serial})` : "—"}</td>
      <td className="p-2 text-sm">
        {marks && <div className="font-semibold text-ink">{marks}</div>}
        {chain(r, all).map((c) => (
          <div key={c}>{c}</div>
        ))}
        {r.note && <div>Note: {r.note}</div>}
        <Photos r={r} />
      </td>
    </tr>
  );
}

export function FlagHistory({ stations }: { stations: FlagDetail["stations"] }) {
  return (
    <section aria-label="Reading history" className="flex flex-col gap-4">
      <h2 className="text-xl font-semibold">
        Readings at {stations.length > 1 ? "the stations it is computed from" : "this station"}
      </h2>
      {stations.map((s) => (
        <div key={s.stationId} className="overflow-x-auto rounded-tool border-2 border-rule bg-panel">
          <h3 className="bg-paper px-3 py-2 font-semibold">{s.words}</h3>
          {s.readings.length === 0 ? (
            <p className="p-3 text-muted">No reading yet.</p>
          ) : (
            <table className="w-full text-left">
              <thead className="text-sm text-muted">
                <tr>
                  <th className="p-2">Taken</th>
                  <th className="p-2">Value</th>
                  <th className="p-2">Verdict</th>
                  <th className="p-2">Gauge</th>
                  <th className="p-2">Notes</th>
                </tr>
              </thead>
              <tbody>
                {s.readings.map((r) => (
                  <Row key={r.id} r={r} all={s.readings} />
                ))}
              </tbody>
            </table>
          )}
        </div>
      ))}
    </section>
  );
}
