import { VerdictBadge } from "@/components/ui/verdict-badge";
import { DISPOSITION_WORDS, type FlagDetail } from "@/lib/schemas/flag";
import { limitsText, when, withUnit } from "./format";

// The derived values this flag feeds, and every decision taken on it (who, when, why).
export function DerivedFed({ derived, isDerived }: { derived: FlagDetail["derived"]; isDerived: boolean }) {
  return (
    <section aria-label="Derived values" className="flex flex-col gap-2">
      <h2 className="text-xl font-semibold">
        {isDerived ? "The computed value now" : "Computed values this reading feeds"}
      </h2>
      {derived.length === 0 ? (
        <p className="text-muted">
          {isDerived
            ? "The value cannot be computed from the current readings."
            : "None: no taper, out-of-round or clearance uses this station."}
        </p>
      ) : (
        <ul className="grid gap-2 md:grid-cols-2">
          {derived.map((d) => (
            <li
              key={d.key}
              className="flex flex-col gap-1 rounded-tool border-2 border-rule bg-panel p-3"
              data-derived-key={d.key}
            >
              <span className="font-semibold">{d.label}</span>
              {d.value === null ? (
                <span className="text-sm text-muted">
                  Waiting for {d.missing.length} more reading{d.missing.length === 1 ? "" : "s"}
                </span>
              ) : (
                <span className="flex flex-wrap items-center gap-3">
                  <span className="tabular text-lg">{withUnit(d.value, d.unit)}</span>
                  {d.verdict ? (
                    <VerdictBadge verdict={d.verdict} size="sm" />
                  ) : (
                    <span className="text-sm text-muted">no limit on the spec</span>
                  )}
                </span>
              )}
              <span className="text-sm text-muted">Limits: {limitsText(d.min, d.max, d.unit)}</span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

export function DecisionHistory({ entries }: { entries: FlagDetail["dispositions"] }) {
  return (
    <section aria-label="Decisions" className="flex flex-col gap-2">
      <h2 className="text-xl font-semibold">Decisions</h2>
      {entries.length === 0 ? (
        <p className="text-muted">No decision yet.</p>
      ) : (
        <ol className="flex flex-col gap-2" data-testid="decisions">
          {entries.map((d) => (
            <li key={d.id} className="rounded-tool border-2 border-l-8 border-rule bg-panel p-3">
              <div className="font-semibold">
                {DISPOSITION_WORDS[d.disposition]}
                {d.operation ? `: ${d.operation}` : ""}
              </div>
              <div className="text-sm text-muted">
                {d.by} · {when(d.at)}
              </div>
              {d.reason && (
                <p className="mt-1 whitespace-pre-wrap">
                  {d.disposition === "accept" ? "Reason: " : "Note: "}
                  {d.reason}
                </p>
              )}
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
