"use client";

import { memo } from "react";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import { formatDeviation, UNIT_WORDS, type DerivedValue } from "@/lib/domain";
import { figure } from "./units";

// Derived values for the part being measured (taper and out-of-round of this bore, its
// piston-to-wall, the oil clearance at this bearing point, this bolt's stretch), live from the
// core as soon as their inputs exist, with verdicts.

/** Where on the part a value applies ("front end · axis A"), without the part's name again. */
function where(d: DerivedValue): string {
  const parts = d.label.split(" · ").slice(1);
  return parts.length > 1 ? parts.slice(1).join(" · ") : parts.join(" · ");
}

export const DerivedPanel = memo(function DerivedPanel({ values }: { values: DerivedValue[] }) {
  if (values.length === 0) return null;
  return (
    <section className="flex flex-col gap-2" aria-label="Derived values" data-testid="derived">
      <h3 className="text-sm font-semibold uppercase tracking-wide text-muted">Worked out from the readings</h3>
      <ul className="flex flex-col gap-2">
        {values.map((d) => (
          <li
            key={d.key}
            className="grid grid-cols-[minmax(0,1fr)_auto] items-center gap-x-3 rounded-tool border-2 border-rule bg-panel px-3 py-2"
            data-key={d.key}
          >
            <span className="flex flex-col">
              <span className="font-medium">{d.label.split(" · ")[0]}</span>
              <span className="text-sm text-muted">{where(d)}</span>
            </span>
            {d.missing.length > 0 || d.value === undefined ? (
              <span className="text-right text-sm text-muted">
                waiting for {d.missing.length} more
                <br />
                reading{d.missing.length === 1 ? "" : "s"}
              </span>
            ) : (
              <span className="flex flex-col items-end gap-1">
                <span className="font-mono text-lg tabular">
                  {figure(d.value, d.unit)} {UNIT_WORDS[d.unit]}
                </span>
                {d.verdict ? (
                  <VerdictBadge verdict={d.verdict} size="sm" />
                ) : (
                  <span className="text-sm text-muted">no limit on the spec</span>
                )}
                {d.deviation !== undefined && (
                  <span className="text-sm text-muted">{formatDeviation(d.deviation, d.unit)}</span>
                )}
              </span>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
});
