// Shared pieces of the maps: markers that tell the axes apart by SHAPE (round A, square B) and
// line style (solid A, dashed B), so the charts read in black and white and without colour.
export const INK = "rgb(var(--c-ink))";
export const STEEL = "rgb(var(--c-steel))";
export const MUTED = "rgb(var(--c-muted))";
export const LINE_A = { stroke: INK, strokeWidth: 2 } as const;
export const LINE_B = { stroke: STEEL, strokeWidth: 2, strokeDasharray: "7 4" } as const;
export const LIMIT = { stroke: MUTED, strokeWidth: 1.5, strokeDasharray: "2 3" } as const;

type DotProps = { cx?: number; cy?: number; index?: number; value?: unknown };

export function RoundDot({ cx, cy, index, value }: DotProps) {
  if (cx === undefined || cy === undefined || value === null || value === undefined) return <g key={`a-${index}`} />;
  return <circle key={`a-${index}`} cx={cx} cy={cy} r={5} fill={INK} stroke="white" strokeWidth={1.5} />;
}

export function SquareDot({ cx, cy, index, value }: DotProps) {
  if (cx === undefined || cy === undefined || value === null || value === undefined) return <g key={`b-${index}`} />;
  return <rect key={`b-${index}`} x={cx - 5} y={cy - 5} width={10} height={10} fill="white" stroke={STEEL} strokeWidth={2.5} />;
}

/** Axis range covering the figures and the limits, with room around them. */
export function domainOf(values: (number | null | undefined)[]): [number, number] | undefined {
  const xs = values.filter((v): v is number => typeof v === "number" && Number.isFinite(v));
  if (!xs.length) return undefined;
  const lo = Math.min(...xs);
  const hi = Math.max(...xs);
  const pad = hi === lo ? Math.max(Math.abs(hi) * 0.0002, 0.0005) : (hi - lo) * 0.25;
  return [lo - pad, hi + pad];
}

export function Legend({ a, b }: { a: string; b: string }) {
  return (
    <ul className="flex flex-wrap gap-x-6 gap-y-2 text-sm" aria-label="How to read the maps">
      <li className="flex items-center gap-2">
        <svg width="44" height="14" aria-hidden="true"><line x1="2" y1="7" x2="42" y2="7" {...LINE_A} /><circle cx="22" cy="7" r="5" fill={INK} stroke="white" strokeWidth="1.5" /></svg>
        {a}: solid line, round marker
      </li>
      <li className="flex items-center gap-2">
        <svg width="44" height="14" aria-hidden="true"><line x1="2" y1="7" x2="42" y2="7" {...LINE_B} /><rect x="17" y="2" width="10" height="10" fill="white" stroke={STEEL} strokeWidth="2.5" /></svg>
        {b}: dashed line, square marker
      </li>
      <li className="flex items-center gap-2">
        <svg width="44" height="14" aria-hidden="true"><line x1="2" y1="7" x2="42" y2="7" {...LIMIT} /></svg>
        Limits (min / max): dotted
      </li>
    </ul>
  );
}

export const distinct = (xs: (number | null)[]) => [...new Set(xs.filter((x): x is number => x !== null))];
