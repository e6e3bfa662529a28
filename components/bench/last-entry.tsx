"use client";

import { VerdictBadge } from "@/components/ui/verdict-badge";
import { formatDeviation, UNIT_WORDS } from "@/lib/domain";
import { useEntryField, type EntryStore } from "@/hooks/use-entry-store";
import { figure } from "./units";

// The answer to the entry just made, painted at once: verdict (colour, word and shape) and how
// far from nominal in the shop's words (tenths or µm). Out of spec on a first reading asks for
// a confirming second one before the route moves on.
export function LastEntryCard({ store, onAgain }: { store: EntryStore; onAgain: (stationId: string) => void }) {
  const last = useEntryField(store, "last");
  if (!last) {
    return (
      <p className="rounded-tool border-2 border-dashed border-rule p-4 text-muted" data-testid="last-entry">
        The verdict of each reading shows here as soon as it is saved.
      </p>
    );
  }
  return (
    <section
      className="flex flex-col gap-2 rounded-tool border-2 border-rule bg-panel p-3 [contain:content]"
      data-testid="last-entry"
      data-seq={last.seq}
      data-verdict={last.verdict ?? "none"}
      aria-live="polite"
    >
      <p className="truncate text-sm text-muted">Last saved · {last.label}</p>
      <div className="flex flex-wrap items-center gap-x-3 gap-y-2">
        {last.verdict && <VerdictBadge verdict={last.verdict} size="lg" />}
        {last.value !== null && (
          <span className="font-mono text-3xl font-semibold tabular">
            {figure(last.value, last.unit)} <span className="text-xl text-muted">{UNIT_WORDS[last.unit]}</span>
          </span>
        )}
        {last.deviation !== undefined && last.deviationUnit && (
          <span className="text-xl font-semibold" data-testid="deviation">
            {formatDeviation(last.deviation, last.deviationUnit)}
          </span>
        )}
        {!last.stayed && (
          <button
            type="button"
            onClick={() => onAgain(last.stationId)}
            className="ml-auto min-h-16 rounded-tool border-2 border-rule px-4 text-lg font-semibold"
          >
            Measure again
          </button>
        )}
      </div>
      {last.lubricant && (
        <p className="text-base" data-testid="last-lubricant">
          Lubricant: <strong>{last.lubricant}</strong>
        </p>
      )}
      {last.note && <p className="text-sm text-muted">{last.note}</p>}
      {last.stayed && (
        <p className="rounded-tool border-l-4 border-fail bg-fail-soft p-3 font-semibold text-fail" role="alert">
          Out of spec. Measure this station again to confirm before moving on.
        </p>
      )}
    </section>
  );
}
