"use client";

import { CartesianGrid, Line, LineChart, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { figure, limitsText, withUnit } from "@/components/flags/format";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import type { Figure, Profile } from "@/lib/schemas/readings";
import { limitLines, LIMIT, LINE_A, LINE_B, MUTED, RoundDot, scaleOf, SquareDot } from "./chart-parts";

// One bore or journal: diameter at each depth (or end) on both axes against the limit lines.
// Bores stand upright (top of bore at the top), journals lie along the crank (front left).
const AT_WORDS: Record<string, string> = { top: "Top", mid: "Middle", bottom: "Bottom", front: "Front", rear: "Rear" };

function FigureLine({ name, f, unit }: { name: string; f: Figure; unit: string }) {
  return (
    <div className="flex flex-wrap items-center gap-2 text-sm">
      <span className="font-medium">{name}</span>
      {f.value === null ? (
        <span className="text-muted">
          {f.missing ? `needs ${f.missing} more reading${f.missing === 1 ? "" : "s"}` : "—"}
        </span>
      ) : (
        <>
          <span className="tabular">{withUnit(f.value, unit)}</span>
          {f.max !== null && <span className="text-muted">(max {figure(f.max, unit)})</span>}
          {f.verdict && <VerdictBadge verdict={f.verdict} size="sm" />}
        </>
      )}
    </div>
  );
}

/** The figures under the chart; only a verdict that needs attention gets a badge. */
function PointsTable({ rows, unit }: { rows: Profile["rows"]; unit: string }) {
  return (
    <table className="w-full text-sm">
      <thead className="text-xs text-muted">
        <tr>
          <th className="text-left font-medium">
            <span className="sr-only">Where</span>
          </th>
          <th className="text-left font-medium">Axis A</th>
          <th className="text-left font-medium">Axis B</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.at}>
            <td className="py-0.5 pr-2 text-muted">{AT_WORDS[r.at] ?? r.at}</td>
            {[r.A, r.B].map((pt, i) => (
              <td key={i} className="py-0.5 pr-2">
                <span className="flex flex-wrap items-center gap-1">
                  <span className="tabular">{figure(pt.value, unit)}</span>
                  {pt.verdict && pt.verdict !== "in_spec" && <VerdictBadge verdict={pt.verdict} size="sm" />}
                </span>
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function ProfileCard({ p, unit, upright }: { p: Profile; unit: string; upright: boolean }) {
  const data = p.rows.map((r) => ({ at: AT_WORDS[r.at] ?? r.at, A: r.A.value, B: r.B.value }));
  const limits = limitLines(p.rows.flatMap((r) => [r.A, r.B]));
  const scale = scaleOf([...data.flatMap((d) => [d.A, d.B]), ...limits.map((l) => l.value)]);
  const hasData = data.some((d) => d.A !== null || d.B !== null);
  const tick = (v: number) => figure(v, unit);
  const valueAxis = {
    type: "number" as const,
    domain: scale?.domain ?? ["auto", "auto"],
    ticks: scale?.ticks,
    tickFormatter: tick,
    tick: { fontSize: 11, fill: MUTED },
    interval: 0 as const,
  };
  // Room at the ends of the place axis so the first and last depth (or end) are not on the frame.
  const placeAxis = {
    type: "category" as const,
    dataKey: "at",
    tick: { fontSize: 12, fill: MUTED },
    padding: upright ? { top: 14, bottom: 14 } : { left: 28, right: 28 },
  };
  const refLine = (v: number) => (upright ? { x: v } : { y: v });
  const first = p.rows.find((r) => r.A.min !== null || r.A.max !== null)?.A ?? p.rows[0]?.A;
  return (
    <figure
      className="flex flex-col gap-2 rounded-tool border-2 border-rule bg-panel p-3 print:break-inside-avoid"
      data-testid={`map-${p.label}`}
    >
      <figcaption className="flex items-baseline justify-between gap-2">
        <span className="font-semibold">{p.label}</span>
        <span className="text-xs text-muted">{first ? limitsText(first.min, first.max, unit) : ""}</span>
      </figcaption>
      {hasData ? (
        <LineChart
          width={300}
          height={upright ? 210 : 190}
          data={data}
          layout={upright ? "vertical" : "horizontal"}
          margin={upright ? { top: 18, right: 18, bottom: 4, left: 4 } : { top: 10, right: 34, bottom: 4, left: 4 }}
        >
          <CartesianGrid stroke="rgb(var(--c-rule))" strokeDasharray="1 4" />
          {upright ? <XAxis {...valueAxis} /> : <XAxis {...placeAxis} />}
          {upright ? <YAxis {...placeAxis} width={60} /> : <YAxis {...valueAxis} width={64} />}
          {limits.map((l) => (
            <ReferenceLine
              key={`${l.label}${l.value}`}
              {...refLine(l.value)}
              {...LIMIT}
              label={{ value: l.label, position: upright ? "top" : "right", fontSize: 10, fill: MUTED }}
            />
          ))}
          <Tooltip formatter={(v) => (typeof v === "number" ? withUnit(v, unit) : String(v))} />
          <Line
            dataKey="A"
            name="Axis A"
            {...LINE_A}
            dot={RoundDot}
            activeDot={false}
            isAnimationActive={false}
            connectNulls={false}
          />
          <Line
            dataKey="B"
            name="Axis B"
            {...LINE_B}
            dot={SquareDot}
            activeDot={false}
            isAnimationActive={false}
            connectNulls={false}
          />
        </LineChart>
      ) : (
        <p className="flex h-24 items-center justify-center rounded-tool border-2 border-dashed border-rule text-sm text-muted">
          No readings yet
        </p>
      )}
      <PointsTable rows={p.rows} unit={unit} />
      <FigureLine name="Taper" f={p.taper} unit={unit} />
      <FigureLine name="Out-of-round" f={p.outOfRound} unit={unit} />
    </figure>
  );
}
