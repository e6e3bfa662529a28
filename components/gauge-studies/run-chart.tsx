"use client";

import { CartesianGrid, Line, LineChart, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { figure, withUnit } from "@/components/flags/format";
import { INK, LIMIT, MUTED, RoundDot, scaleOf, STEEL } from "@/components/maps/chart-parts";
import { characteristicWords } from "@/lib/domain";
import { tightest } from "./bins";

// A repeatability run in the order taken: every reading against the reference (solid), the study's mean
// (dashed) and the band of ±10 % of the tightest tolerance the gauge judges (dotted), the band Cgk is
// measured against. Shapes and line styles tell the lines apart without colour.
const REFERENCE = { stroke: INK, strokeWidth: 1.5 } as const;
const MEAN = { stroke: STEEL, strokeWidth: 1.5, strokeDasharray: "7 4" } as const;

export interface RunChartProps {
  readings: readonly number[];
  reference: number;
  unit: string;
  /** The characteristics the gauge judges; the band is drawn for the one with the smallest tolerance. */
  characteristics?: readonly { characteristic: string; tolerance: number }[];
  /** The core's mean of the run (lib/domain/gauge-studies); without it no mean line is drawn. */
  mean?: number;
  width?: number;
  height?: number;
}

export function RunChart(props: RunChartProps) {
  const { readings, reference, unit, characteristics = [], mean: avg, width = 520, height = 240 } = props;
  const data = readings.map((value, i) => ({ n: i + 1, value }));
  const tight = tightest(characteristics);
  const half = tight ? tight.tolerance / 10 : null;
  const band = half === null ? [] : [reference - half, reference + half];
  const scale = scaleOf([...readings, reference, ...band]);
  const outside = half === null ? 0 : readings.filter((r) => Math.abs(r - reference) > half + 1e-12).length;
  return (
    <figure
      className="flex flex-col gap-2 rounded-tool border-2 border-rule bg-panel p-3"
      data-testid="study-run-chart"
    >
      <figcaption className="flex flex-col gap-0.5">
        <span className="font-semibold">Readings in the order taken</span>
        <span className="text-xs text-muted">
          {readings.length} reading{readings.length === 1 ? "" : "s"} of a reference of {withUnit(reference, unit)}
          {avg !== undefined && `; mean ${withUnit(avg, unit)}`}
        </span>
      </figcaption>
      {readings.length ? (
        <LineChart width={width} height={height} data={data} margin={{ top: 10, right: 64, bottom: 4, left: 4 }}>
          <CartesianGrid stroke="rgb(var(--c-rule))" strokeDasharray="1 4" />
          <XAxis
            type="number"
            dataKey="n"
            domain={[1, Math.max(2, readings.length)]}
            allowDecimals={false}
            tick={{ fontSize: 11, fill: MUTED }}
            padding={{ left: 8, right: 8 }}
          />
          <YAxis
            type="number"
            domain={scale?.domain ?? ["auto", "auto"]}
            ticks={scale?.ticks}
            interval={0}
            tickFormatter={(v: number) => figure(v, unit)}
            tick={{ fontSize: 11, fill: MUTED }}
            width={72}
          />
          <ReferenceLine y={reference} {...REFERENCE} label={refLabel("reference")} />
          {avg !== undefined && <ReferenceLine y={avg} {...MEAN} label={refLabel("mean", "insideBottomRight")} />}
          {band.map((y, i) => (
            <ReferenceLine key={i} y={y} {...LIMIT} label={refLabel(i === 0 ? "−0.1 T" : "+0.1 T")} />
          ))}
          <Tooltip
            labelFormatter={(n) => `Reading ${n}`}
            formatter={(v) => (typeof v === "number" ? withUnit(v, unit) : String(v))}
          />
          <Line
            dataKey="value"
            name="Reading"
            stroke={INK}
            strokeWidth={1}
            dot={RoundDot}
            activeDot={false}
            isAnimationActive={false}
          />
        </LineChart>
      ) : (
        <p className="flex h-24 items-center justify-center rounded-tool border-2 border-dashed border-rule text-sm">
          No readings yet
        </p>
      )}
      <p className="text-xs text-muted">
        Reference: solid line.{avg !== undefined && " Mean: dashed line."}
        {tight && half !== null
          ? ` ±0.1 T: dotted lines, ±${withUnit(half, unit)} for ${characteristicWords(tight.characteristic)} ` +
            `(T = ${withUnit(tight.tolerance, unit)}, the tightest it judges); ` +
            (outside ? `${outside} reading${outside === 1 ? "" : "s"} outside.` : "every reading inside.")
          : " No tolerance given, so no ±0.1 T band."}
      </p>
    </figure>
  );
}

function refLabel(value: string, position: "right" | "insideBottomRight" = "right") {
  return { value, position, fontSize: 10, fill: MUTED };
}
