import type { FlagListItem } from "@/lib/schemas/flag";
import { deviationText, limitsText, when } from "./format";

// Cells the wide queue shows as columns and a tablet folds into the station's cell.

export function GaugeText({ flag }: { flag: FlagListItem }) {
  const g = flag.gauge;
  if (flag.derived) return <span className="text-muted">computed from readings</span>;
  if (!g) return <span className="text-muted">none recorded</span>;
  return (
    <span>
      {g.label} <span className="font-mono text-xs text-muted">{g.serial}</span>
    </span>
  );
}

export const takenBy = (flag: FlagListItem) => flag.takenBy ?? (flag.derived ? "—" : "unknown");
export const takenWhen = (flag: FlagListItem) => when(flag.takenAt ?? flag.createdAt);

/**
 * The columns a narrow screen hides, as small lines under the station: the job below 1024 px
 * (lg), limits, deviation, gauge and who took it below 1280 px (xl).
 */
export function FoldedDetail({ flag }: { flag: FlagListItem }) {
  return (
    <span className="flex flex-col text-xs font-normal text-muted xl:hidden" data-testid="flag-fold">
      <span className="lg:hidden">
        Job <span className="font-mono">{flag.jobCode}</span> · {flag.jobTitle}
      </span>
      <span className="tabular">
        Limits {limitsText(flag.limitMin, flag.limitMax, flag.unit)} · deviation{" "}
        {deviationText(flag.deviation, flag.unit)}
      </span>
      <span>
        <GaugeText flag={flag} />
        {flag.derived ? "" : ` · ${takenBy(flag)}`}, {takenWhen(flag)}
      </span>
    </span>
  );
}
