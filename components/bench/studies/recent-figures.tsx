import { gaugeFigure } from "./figures";

/** The last few figures of a run, newest first, numbered as taken. */
export function RecentFigures({
  values,
  resolution,
  label,
}: {
  values: number[];
  resolution: number;
  label: (i: number) => string;
}) {
  const last = values
    .map((v, i) => ({ v, i }))
    .slice(-6)
    .reverse();
  return (
    <ol className="flex flex-col gap-1" aria-label="Last figures" data-testid="recent-figures">
      {last.map(({ v, i }) => (
        <li key={i} className="flex justify-between gap-3 border-b border-rule py-1 font-mono tabular">
          <span className="text-muted">{label(i)}</span>
          <span className="font-semibold">{gaugeFigure(v, resolution)}</span>
        </li>
      ))}
      {values.length === 0 && <li className="text-muted">No figure yet.</li>}
    </ol>
  );
}
