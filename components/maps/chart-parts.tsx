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
  return (
    <rect
      key={`b-${index}`}
      x={cx - 6}
      y={cy - 6}
      width={12}
      height={12}
      fill="none"
      stroke={STEEL}
      strokeWidth={2.5}
    />
  );
}

const round = (x: number) => Number(x.toFixed(9));

/**
 * Axis range and round ticks covering the figures and the limits: a step of 1, 2 or 5 × 10ⁿ
 * giving at most five intervals, so ticks read 4.0298, 4.0300… rather than 4.02977.
 */
export function scaleOf(
  values: (number | null | undefined)[],
): { domain: [number, number]; ticks: number[] } | undefined {
  const xs = values.filter((v): v is number => typeof v === "number" && Number.isFinite(v));
  if (!xs.length) return undefined;
  let lo = Math.min(...xs);
  let hi = Math.max(...xs);
  const span = hi - lo || Math.max(Math.abs(hi) * 0.0001, 0.0001);
  lo -= span * 0.15;
  hi += span * 0.15;
  const raw = (hi - lo) / 5;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? 10 * mag;
  const first = round(Math.floor(lo / step) * step);
  const last = round(Math.ceil(hi / step) * step);
  const ticks: number[] = [];
  for (let t = first; t <= last + step / 2; t = round(t + step)) ticks.push(t);
  return { domain: [first, last], ticks };
}

export function Legend({ a, b }: { a: string; b: string }) {
  return (
    <ul className="flex flex-wrap gap-x-6 gap-y-2 text-sm" aria-label="How to read the maps">
      <li className="flex items-center gap-2">
        <svg width="44" height="14" aria-hidden="true">
          <line x1="2" y1="7" x2="42" y2="7" {...LINE_A} />
          <circle cx="22" cy="7" r="5" fill={INK} stroke="white" strokeWidth="1.5" />
        </svg>
        {a}: solid line, round marker
      </li>
      <li className="flex items-center gap-2">
        <svg width="44" height="14" aria-hidden="true">
          <line x1="2" y1="7" x2="42" y2="7" {...LINE_B} />
          <rect x="16" y="1" width="12" height="12" fill="none" stroke={STEEL} strokeWidth="2.5" />
        </svg>
        {b}: dashed line, square marker
      </li>
      <li className="flex items-center gap-2">
        <svg width="44" height="14" aria-hidden="true">
          <line x1="2" y1="7" x2="42" y2="7" {...LIMIT} />
        </svg>
        Limits (min / max): dotted
      </li>
    </ul>
  );
}

/** The limit lines of a chart: each distinct minimum and maximum, labelled min or max. */
export function limitLines(
  points: { min: number | null; max: number | null }[],
): { value: number; label: "min" | "max" }[] {
  const of = (k: "min" | "max") =>
    [...new Set(points.map((p) => p[k]).filter((x): x is number => x !== null))].map((value) => ({ value, label: k }));
  return [...of("min"), ...of("max")];
}
