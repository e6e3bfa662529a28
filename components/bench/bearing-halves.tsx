"use client";

import { memo } from "react";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import { bearingPointOfStation, lengthWords, type DerivedValue } from "@/lib/domain";
import type { BenchBearing } from "@/lib/schemas/sync-pack";

// At an installed-bore station: which halves go where (from the lead's saved choice, carried in
// the job pack so it shows offline) and, once the bore is read here, the clearance predicted for
// those halves beside the one measured, with the difference.

export const BearingHalves = memo(function BearingHalves({
  stationId,
  bearings,
  derived,
}: {
  stationId: string;
  bearings: BenchBearing[] | undefined;
  derived: DerivedValue[];
}) {
  const point = bearingPointOfStation(stationId);
  if (!point) return null;
  const chosen = bearings?.find((b) => b.point === point);
  if (!chosen) {
    return (
      <p
        className="rounded-tool border-2 border-dashed border-rule p-3 text-sm text-muted"
        data-testid="bearing-halves"
      >
        No halves chosen on the desk for this bearing yet: fit the shells the lead gives you.
      </p>
    );
  }
  const here = derived.find((d) => d.stationId === stationId && d.value !== undefined && !d.missing.length);
  const unit = chosen.unit;
  const diff = here && chosen.predicted !== null ? Number((here.value! - chosen.predicted).toPrecision(12)) : undefined;
  return (
    <section
      aria-label="Bearing halves"
      data-testid="bearing-halves"
      className="flex flex-col gap-2 rounded-tool border-2 border-steel bg-panel p-3"
    >
      <h3 className="text-sm font-semibold uppercase tracking-wide text-muted">Halves chosen for this bearing</h3>
      <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-3 gap-y-1">
        <dt className="font-semibold">{chosen.upper.place}</dt>
        <dd>{chosen.upper.words}</dd>
        <dt className="font-semibold">{chosen.lower.place}</dt>
        <dd>{chosen.lower.words}</dd>
      </dl>
      <div className="grid grid-cols-3 gap-2 text-center" data-testid="bearing-compare">
        <span className="flex flex-col">
          <span className="text-xs text-muted">Predicted</span>
          <span className="font-mono tabular">
            {chosen.predicted === null ? "—" : lengthWords(chosen.predicted, unit)}
          </span>
          {chosen.uncertainty !== null && (
            <span className="text-xs text-muted">± {lengthWords(chosen.uncertainty, unit)}</span>
          )}
        </span>
        <span className="flex flex-col items-center">
          <span className="text-xs text-muted">Measured here</span>
          <span className="font-mono tabular">{here ? lengthWords(here.value!, unit) : "not yet"}</span>
          {here?.verdict && <VerdictBadge verdict={here.verdict} size="sm" />}
        </span>
        <span className="flex flex-col">
          <span className="text-xs text-muted">Difference</span>
          <span className="font-mono tabular">
            {diff === undefined ? "—" : `${diff >= 0 ? "+" : "−"}${lengthWords(Math.abs(diff), unit)}`}
          </span>
        </span>
      </div>
    </section>
  );
});
