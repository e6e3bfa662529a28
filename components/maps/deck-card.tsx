"use client";

import { CartesianGrid, Line, LineChart, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { figure, limitsText, withUnit } from "@/components/flags/format";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import type { DeckCorner } from "@/lib/schemas/readings";
import { limitLines, LIMIT, LINE_A, LINE_B, MUTED, RoundDot, scaleOf, SquareDot } from "./chart-parts";

// Deck height at each corner: one line per bank (left solid/round, right dashed/square), front
// to rear, against the limit lines; a tilt from front to rear or a step between banks shows at once.
const BANK_WORDS: Record<string, string> = { block: "Deck", left: "Left bank", right: "Right bank" };

export function DeckCard({ corners, unit }: { corners: DeckCorner[]; unit: string }) {
  const banks = [...new Set(corners.map((c) => c.bank))];
  const data = (["front", "rear"] as const).map((corner) => ({
    at: corner === "front" ? "Front" : "Rear",
    ...Object.fromEntries(
      banks.map((b) => [b, corners.find((c) => c.bank === b && c.corner === corner)?.point.value ?? null]),
    ),
  }));
  const limits = limitLines(corners.map((c) => c.point));
  const scale = scaleOf([...corners.map((c) => c.point.value), ...limits.map((l) => l.value)]);
  const hasData = corners.some((c) => c.point.value !== null);
  const first = corners.find((c) => c.point.min !== null || c.point.max !== null)?.point;
  return (
    <figure
      className="flex max-w-xl flex-col gap-2 rounded-tool border-2 border-rule bg-panel p-3 print:break-inside-avoid"
      data-testid="map-deck"
    >
      <figcaption className="flex items-baseline justify-between gap-2">
        <span className="font-semibold">Deck height by corner</span>
        <span className="text-xs text-muted">{first ? limitsText(first.min, first.max, unit) : ""}</span>
      </figcaption>
      {hasData ? (
        <LineChart width={420} height={220} data={data} margin={{ top: 10, right: 34, bottom: 4, left: 4 }}>
          <CartesianGrid stroke="rgb(var(--c-rule))" strokeDasharray="1 4" />
          <XAxis type="category" dataKey="at" tick={{ fontSize: 12, fill: MUTED }} padding={{ left: 40, right: 40 }} />
          <YAxis
            type="number"
            domain={scale?.domain ?? ["auto", "auto"]}
            ticks={scale?.ticks}
            interval={0}
            tickFormatter={(v: number) => figure(v, unit)}
            tick={{ fontSize: 11, fill: MUTED }}
            width={64}
          />
          {limits.map((l) => (
            <ReferenceLine
              key={`${l.label}${l.value}`}
              y={l.value}
              {...LIMIT}
              label={{ value: l.label, position: "right", fontSize: 10, fill: MUTED }}
            />
          ))}
          <Tooltip formatter={(v) => (typeof v === "number" ? withUnit(v, unit) : String(v))} />
          {banks.map((b, i) => (
            <Line
              key={b}
              dataKey={b}
              name={BANK_WORDS[b] ?? b}
              {...(i === 0 ? LINE_A : LINE_B)}
              dot={i === 0 ? RoundDot : SquareDot}
              activeDot={false}
              isAnimationActive={false}
              connectNulls={false}
            />
          ))}
        </LineChart>
      ) : (
        <p className="flex h-24 items-center justify-center rounded-tool border-2 border-dashed border-rule text-sm text-muted">
          No deck readings yet
        </p>
      )}
      <table className="w-full text-sm">
        <thead className="text-xs text-muted">
          <tr>
            <th className="text-left font-medium">Corner</th>
            <th className="text-left font-medium">Height</th>
            <th className="text-left font-medium">Verdict</th>
          </tr>
        </thead>
        <tbody>
          {corners.map((c) => (
            <tr key={`${c.bank}/${c.corner}`}>
              <td className="py-0.5 pr-2 text-muted">
                {BANK_WORDS[c.bank] ?? c.bank}, {c.corner}
              </td>
              <td className="tabular py-0.5 pr-2">{figure(c.point.value, unit)}</td>
              <td className="py-0.5">
                {c.point.verdict ? (
                  <VerdictBadge verdict={c.point.verdict} size="sm" />
                ) : (
                  <span className="text-muted">—</span>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {banks.length > 1 && (
        <p className="text-xs text-muted">
          Left bank: solid line, round marker. Right bank: dashed line, square marker.
        </p>
      )}
    </figure>
  );
}
