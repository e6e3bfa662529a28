import { VerdictBadge } from "@/components/ui/verdict-badge";
import { VERDICTS } from "@/lib/domain";
import type { ReadingCounts } from "@/lib/schemas/release";

// The current readings by verdict, plus what is not judged and how much history sits behind them.
export function ReadingsSummary({ counts }: { counts: ReadingCounts }) {
  const extra = [
    [counts.skipped, "skipped"],
    [counts.unjudged, "with no limit on the spec"],
    [counts.superseded, "earlier readings kept as history"],
  ] as const;
  return (
    <section aria-labelledby="readings-h" className="rounded-tool border-2 border-rule bg-panel p-4">
      <h2 id="readings-h" className="text-xl font-semibold">
        Readings
      </h2>
      <p className="text-sm text-muted">{counts.current} current readings</p>
      <ul className="mt-3 flex flex-wrap gap-3">
        {VERDICTS.map((v) => (
          <li key={v} className="flex items-center gap-2" data-count={v}>
            <VerdictBadge verdict={v} />
            <span className="tabular text-lg font-semibold">{counts[v]}</span>
          </li>
        ))}
      </ul>
      <ul className="mt-3 flex flex-wrap gap-x-4 text-sm text-muted">
        {extra.map(([n, words]) => (
          <li key={words}>
            <span className="tabular font-semibold text-ink">{n}</span> {words}
          </li>
        ))}
      </ul>
    </section>
  );
}
