"use client";

import { Bar, CartesianGrid, ComposedChart, Line, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { figure, withUnit } from "@/components/flags/format";
import { INK, MUTED, STEEL } from "@/components/maps/chart-parts";
import { expectedCount, histogramBins } from "./bins";

// How a repeatability run spreads: bars count the readings in each bin (a bin is a whole number of gauge
// steps), the dashed curve is what a normal spread with the run's mean and s would put there, and the
// solid line marks the bin holding the reference.
export interface StudyHistogramProps {
  readings: readonly number[];
  reference: number;
  /** The gauge's smallest step; bins are whole numbers of it. */
  resolution: number | null;
  unit: string;
  /** The core's mean and s of the run (lib/domain/gauge-studies); without them no curve is drawn. */
  mean?: number;
  sd?: number;
  width?: number;
  height?: number;
}

export function StudyHistogram(props: StudyHistogramProps) {
  const { readings, reference, resolution, unit, mean, sd, width = 520, height = 220 } = props;
  const bins = histogramBins(readings, { resolution, reference });
  const fit = mean !== undefined && sd !== undefined && sd > 0 ? { mean, sd } : null;
  const label = (b: { centre: number }) => figure(b.centre, unit);
  const data = bins.map((b) => ({
    bin: label(b),
    count: b.count,
    expected: fit ? Number(expectedCount(b, readings.length, fit.mean, fit.sd).toFixed(2)) : null,
    range: `${figure(b.from, unit)} to ${figure(b.to, unit)}`,
  }));
  const refBin = bins.find((b) => reference >= b.from && reference < b.to);
  const most = Math.max(1, ...bins.map((b) => b.count));
  return (
    <figure
      className="flex flex-col gap-2 rounded-tool border-2 border-rule bg-panel p-3"
      data-testid="study-histogram"
    >
      <figcaption className="flex flex-col gap-0.5">
        <span className="font-semibold">How the readings spread</span>
        <span className="text-xs text-muted">
          Readings per bin of {bins.length ? withUnit(bins[0].to - bins[0].from, unit) : "—"}
        </span>
      </figcaption>
      {bins.length ? (
        <ComposedChart width={width} height={height} data={data} margin={{ top: 10, right: 16, bottom: 4, left: 4 }}>
          <CartesianGrid stroke="rgb(var(--c-rule))" strokeDasharray="1 4" vertical={false} />
          <XAxis dataKey="bin" tick={{ fontSize: 10, fill: MUTED }} interval="preserveStartEnd" />
          <YAxis allowDecimals={false} domain={[0, most]} tick={{ fontSize: 11, fill: MUTED }} width={32} />
          {refBin && (
            <ReferenceLine
              x={label(refBin)}
              stroke={INK}
              strokeWidth={1.5}
              label={{ value: "reference", position: "top", fontSize: 10, fill: MUTED }}
            />
          )}
          <Tooltip
            labelFormatter={(_, items) => String(items?.[0]?.payload?.range ?? "")}
            formatter={(v, name) => [String(v), name === "count" ? "Readings" : "Normal curve"]}
          />
          <Bar dataKey="count" name="count" fill={STEEL} fillOpacity={0.35} stroke={STEEL} isAnimationActive={false} />
          {fit && (
            <Line
              dataKey="expected"
              name="expected"
              type="monotone"
              stroke={INK}
              strokeDasharray="5 4"
              strokeWidth={1.5}
              dot={false}
              activeDot={false}
              isAnimationActive={false}
            />
          )}
        </ComposedChart>
      ) : (
        <p className="flex h-24 items-center justify-center rounded-tool border-2 border-dashed border-rule text-sm">
          No readings yet
        </p>
      )}
      <p className="text-xs text-muted">
        Bars: readings in each bin.
        {fit && " Dashed curve: a normal spread with the run’s mean and s."}
        {refBin ? " Solid line: the bin holding the reference." : " The reference lies outside every bin."}
      </p>
    </figure>
  );
}
